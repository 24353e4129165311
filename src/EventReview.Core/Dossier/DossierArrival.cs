namespace EventReview.Core.Dossier;

/// <summary>Arrival at one site: GPS nanoseconds, the same as decimal seconds text, and the site's SNR (dimensionless).</summary>
public sealed record DossierArrival(string SiteCode, long ArrivalGpsNanoseconds, string ArrivalGps, double Snr);
