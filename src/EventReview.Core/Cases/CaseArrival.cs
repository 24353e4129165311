using EventReview.Core.Inputs;
using EventReview.Core.Time;

namespace EventReview.Core.Cases;

/// <summary>The candidate's arrival at one site: the site code, the GPS arrival time and the site's SNR.</summary>
public sealed class CaseArrival
{
    private CaseArrival()
    {
        SiteCode = string.Empty;
    }

    /// <summary>Creates a validated arrival.</summary>
    /// <exception cref="ArgumentOutOfRangeException">
    /// Naming the field (<c>site</c>, <c>gpsTime</c>, <c>snr</c>): a site code that is not 1-8 letters or digits, a time
    /// outside <see cref="GpsRange"/>, an SNR that is not finite or outside [0, <see cref="InputLimits.MaxSnr"/>].
    /// </exception>
    public CaseArrival(string siteCode, GpsTime arrival, double snr)
    {
        var code = (siteCode ?? string.Empty).Trim().ToUpperInvariant();
        if (code.Length is < 1 or > 8 || !code.All(char.IsAsciiLetterOrDigit))
        {
            throw new ArgumentOutOfRangeException("site", siteCode, "site: an arrival's site code must be 1-8 letters or digits.");
        }

        InputGuard.Gps(arrival, "gpsTime");
        InputGuard.Finite(snr, 0, InputLimits.MaxSnr, "snr", $"the SNR at site {code}");
        SiteCode = code;
        ArrivalNanoseconds = arrival.Nanoseconds;
        Snr = snr;
    }

    /// <summary>Database key of the arrival.</summary>
    public int Id { get; private set; }

    /// <summary>Code of the site, upper case, 1-8 letters or digits (as <see cref="Network.Site.Code"/>).</summary>
    public string SiteCode { get; private set; }

    /// <summary>Arrival time, GPS nanoseconds (see <see cref="Arrival"/>).</summary>
    public long ArrivalNanoseconds { get; private set; }

    /// <summary>Arrival time on the GPS scale.</summary>
    public GpsTime Arrival => new(ArrivalNanoseconds);

    /// <summary>Signal-to-noise ratio reported by the search at this site (dimensionless).</summary>
    public double Snr { get; private set; }
}
