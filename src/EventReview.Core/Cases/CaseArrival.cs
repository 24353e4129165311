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
    public CaseArrival(string siteCode, GpsTime arrival, double snr)
    {
        if (string.IsNullOrWhiteSpace(siteCode))
        {
            throw new ArgumentOutOfRangeException(nameof(siteCode), siteCode, "Arrival site code must not be empty.");
        }

        if (!double.IsFinite(snr) || snr < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(snr), snr, $"SNR at site {siteCode} must be a finite number >= 0.");
        }

        SiteCode = siteCode.Trim().ToUpperInvariant();
        ArrivalNanoseconds = arrival.Nanoseconds;
        Snr = snr;
    }

    public int Id { get; private set; }

    public string SiteCode { get; private set; }

    /// <summary>Arrival time, GPS nanoseconds (see <see cref="Arrival"/>).</summary>
    public long ArrivalNanoseconds { get; private set; }

    /// <summary>Arrival time on the GPS scale.</summary>
    public GpsTime Arrival => new(ArrivalNanoseconds);

    /// <summary>Signal-to-noise ratio reported by the search at this site (dimensionless).</summary>
    public double Snr { get; private set; }
}
