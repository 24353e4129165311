namespace EventReview.Web.Services.Checks;

/// <summary>One site's inputs to the background check: its trigger list and its analysed-time segments, as attachment hashes.</summary>
/// <param name="SiteCode">Site code, one of the case's arrivals.</param>
/// <param name="TriggersSha256">SHA-256 of the attached trigger CSV (gps_time,snr[,chirp_mass,frequency_hz]).</param>
/// <param name="SegmentsSha256">SHA-256 of the attached segment CSV (start_gps,end_gps).</param>
public sealed record BackgroundSiteFiles(string SiteCode, string TriggersSha256, string SegmentsSha256);
