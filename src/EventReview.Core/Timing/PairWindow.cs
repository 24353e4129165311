using System.Globalization;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;

namespace EventReview.Core.Timing;

/// <summary>
/// The largest arrival-time difference two sites can show for one plane wave, within their timing uncertainties:
/// allowed = light-travel time d / c + k × sqrt(σa² + σb²). The one home of this rule: the timing check judges each pair
/// with it and the overlap check searches and judges its lag with it. Seconds and metres.
/// </summary>
/// <param name="A">Code of site a.</param>
/// <param name="B">Code of site b.</param>
/// <param name="BaselineMeters">Straight-line distance between the sites, metres.</param>
/// <param name="LightTravelSeconds">d / c, seconds.</param>
/// <param name="CombinedSigmaSeconds">sqrt(σa² + σb²), seconds (one sigma, the sites' timing uncertainties taken as independent).</param>
/// <param name="KSigma">k, the number of combined sigmas allowed beyond the light-travel time.</param>
/// <param name="AllowedSeconds">Light-travel + k × combined sigma, seconds.</param>
public sealed record PairWindow(string A, string B, double BaselineMeters, double LightTravelSeconds, double CombinedSigmaSeconds, double KSigma,
    double AllowedSeconds)
{
    /// <summary>The window of sites a and b with k combined sigmas.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When k is not a finite number ≥ 0.</exception>
    public static PairWindow For(Site a, Site b, double kSigma)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        if (!double.IsFinite(kSigma) || kSigma < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(kSigma), kSigma, "k must be a finite number ≥ 0.");
        }

        var baseline = Baseline.Between(a, b);
        var sigma = Math.Sqrt((a.TimingUncertaintySeconds * a.TimingUncertaintySeconds) + (b.TimingUncertaintySeconds * b.TimingUncertaintySeconds));
        return new PairWindow(a.Code, b.Code, baseline.BaselineMeters, baseline.LightTravelSeconds, sigma, kSigma, baseline.LightTravelSeconds + (kSigma * sigma));
    }

    /// <summary>The rule in words with its numbers: "±12.41 ms = light-travel AB–KP 12.00 ms + 3σ × 0.137 ms".</summary>
    public string Rule => string.Create(CultureInfo.InvariantCulture,
        $"±{AllowedSeconds * 1e3:0.00} ms = light-travel {A}–{B} {LightTravelSeconds * 1e3:0.00} ms + {KSigma:0.##}σ × {CombinedSigmaSeconds * 1e3:0.000} ms combined timing uncertainty");

    /// <summary>True when |<paramref name="differenceSeconds"/>| is within the allowed window (to 1 ns, the resolution of GPS times).</summary>
    public bool Allows(double differenceSeconds) => Math.Abs(differenceSeconds) <= AllowedSeconds + 1e-9;
}
