using EventReview.Core.Time;

namespace EventReview.Core.Timing;

/// <summary>The arrival time of the candidate at one site (GPS), with the site's SNR when known (dimensionless, finite, ≥ 0).</summary>
public sealed record SiteArrival(string SiteCode, GpsTime Arrival, double? Snr = null);
