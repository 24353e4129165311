using System.Globalization;
using EventReview.Core.Signal;
using EventReview.Core.Time;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Parameters of the overlap check as run from a case. Null fields take defaults from the case and the network: sites = the
/// two loudest arrivals (A the louder), centre = the case's GPS time, maximum lag = light-travel time between the two sites +
/// <see cref="KSigma"/> × the combined timing uncertainty. The stored record holds these parameters with the defaults filled in.
/// </summary>
/// <param name="FileA">Strain of site A.</param>
/// <param name="FileB">Strain of site B.</param>
/// <param name="SiteA">Site code of A (null: the loudest arrival).</param>
/// <param name="SiteB">Site code of B (null: the second loudest arrival).</param>
/// <param name="CenterGps">Centre of the on-source window, GPS seconds (null: the case's time).</param>
/// <param name="WindowSeconds">On-source correlation window, seconds.</param>
/// <param name="MaxLagMs">Largest |lag| searched and allowed, ms (null: from the network as above).</param>
/// <param name="BandLowHz">Band-pass lower edge, Hz.</param>
/// <param name="BandHighHz">Band-pass upper edge, Hz.</param>
/// <param name="PsdSegmentSeconds">Welch PSD segment length, seconds.</param>
/// <param name="NotchesHz">Line frequencies to notch out, Hz (empty for none).</param>
/// <param name="OffSourceTrials">Number of off-source (time-slid) overlaps for the empirical p-value (0 for none).</param>
/// <param name="OverlapThreshold">Smallest |overlap| called consistent (default 0.5, our choice: in a 0.2 s window at the default band noise limits even a perfectly matched signal at per-site SNR ~15 to about 0.6, so the off-source p-value is the main test).</param>
/// <param name="PValueThreshold">Largest off-source p-value called consistent.</param>
/// <param name="KSigma">k in the default maximum lag (light-travel + k σ).</param>
public sealed record OverlapCheckParameters(
    StrainPick FileA,
    StrainPick FileB,
    string? SiteA = null,
    string? SiteB = null,
    decimal? CenterGps = null,
    double WindowSeconds = 0.2,
    double? MaxLagMs = null,
    double BandLowHz = ConditioningOptions.DefaultLowHz,
    double BandHighHz = ConditioningOptions.DefaultHighHz,
    double PsdSegmentSeconds = 4,
    IReadOnlyList<double>? NotchesHz = null,
    int OffSourceTrials = 200,
    double OverlapThreshold = 0.5,
    double PValueThreshold = 0.01,
    double KSigma = 3)
{
    /// <exception cref="ArgumentException">When a value is out of range (message names it).</exception>
    public void Validate()
    {
        if (string.IsNullOrWhiteSpace(FileA?.Sha256) || string.IsNullOrWhiteSpace(FileB?.Sha256))
        {
            throw new ArgumentException("Pick a strain file for site A and for site B.", nameof(FileA));
        }

        if (FileA.Sha256 == FileB.Sha256 && FileA.Hdf5Dataset == FileB.Hdf5Dataset)
        {
            throw new ArgumentException("Sites A and B use the same strain file; pick one file per site.", nameof(FileB));
        }

        Require(double.IsFinite(WindowSeconds) && WindowSeconds >= 0.01 && WindowSeconds <= 10, "Window must be between 0.01 and 10 s.", nameof(WindowSeconds));
        Require(MaxLagMs is null || (double.IsFinite(MaxLagMs.Value) && MaxLagMs >= 0 && MaxLagMs <= 1000), "Maximum lag must be between 0 and 1000 ms.", nameof(MaxLagMs));
        Require(double.IsFinite(BandLowHz) && double.IsFinite(BandHighHz) && BandLowHz > 0 && BandHighHz > BandLowHz, "Band must satisfy 0 < low < high (Hz).", nameof(BandLowHz));
        Require(double.IsFinite(PsdSegmentSeconds) && PsdSegmentSeconds >= 0.0625 && PsdSegmentSeconds <= 64, "PSD segment must be between 0.0625 and 64 s.", nameof(PsdSegmentSeconds));
        Require((NotchesHz ?? []).All(f => double.IsFinite(f) && f > 0), "Notch frequencies must be positive numbers of Hz.", nameof(NotchesHz));
        Require(OffSourceTrials is >= 0 and <= 100_000, "Off-source trials must be between 0 and 100,000.", nameof(OffSourceTrials));
        Require(double.IsFinite(OverlapThreshold) && OverlapThreshold > 0 && OverlapThreshold <= 1, "Overlap threshold must be in (0, 1].", nameof(OverlapThreshold));
        Require(double.IsFinite(PValueThreshold) && PValueThreshold > 0 && PValueThreshold < 1, "p-value threshold must be in (0, 1).", nameof(PValueThreshold));
        Require(double.IsFinite(KSigma) && KSigma > 0 && KSigma <= 10, "k (number of sigmas) must be > 0 and at most 10.", nameof(KSigma));
        if (SiteA is not null && SiteB is not null && string.Equals(SiteA, SiteB, StringComparison.OrdinalIgnoreCase))
        {
            throw new ArgumentException("Sites A and B must differ.", nameof(SiteB));
        }
    }

    /// <summary>
    /// Reads the run form's centre field: GPS seconds parsed by <see cref="GpsTime.TryParse"/> to the nanosecond; blank
    /// gives null (the case's time). On failure <paramref name="problem"/> names the field.
    /// </summary>
    public static bool TryParseCentre(string? text, out decimal? centerGps, out string? problem)
    {
        centerGps = null;
        problem = null;
        if (string.IsNullOrWhiteSpace(text))
        {
            return true;
        }

        if (!GpsTime.TryParse(text, out var t))
        {
            problem = $"Centre (GPS s): \"{text.Trim()}\" is not a GPS time in seconds (e.g. 1400000000.25).";
            return false;
        }

        centerGps = t.Nanoseconds / (decimal)GpsTime.NanosecondsPerSecond;
        return true;
    }

    /// <summary>
    /// Reads the run form's notches field: frequencies in Hz separated by commas, semicolons or spaces; blank gives none.
    /// Only the reading is checked here (a positive finite value is <see cref="Validate"/>'s rule). On failure
    /// <paramref name="problem"/> names the field and the part that is not a number.
    /// </summary>
    public static bool TryParseNotches(string? text, out IReadOnlyList<double> notchesHz, out string? problem)
    {
        var notches = new List<double>();
        notchesHz = notches;
        problem = null;
        foreach (var part in (text ?? string.Empty).Split([',', ';', ' '], StringSplitOptions.RemoveEmptyEntries))
        {
            if (!double.TryParse(part, NumberStyles.Float, CultureInfo.InvariantCulture, out var f))
            {
                problem = $"Notches (Hz): \"{part}\" is not a frequency in Hz.";
                return false;
            }

            notches.Add(f);
        }

        return true;
    }

    private static void Require(bool ok, string message, string name)
    {
        if (!ok)
        {
            throw new ArgumentException(message, name);
        }
    }
}
