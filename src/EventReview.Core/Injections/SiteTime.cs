namespace EventReview.Core.Injections;

/// <summary>A site and the GPS time (seconds) at which it was looked up.</summary>
/// <param name="Site">Site code.</param>
/// <param name="Gps">GPS seconds used for the site.</param>
/// <param name="FromArrival">True when the site's own arrival time was used, false when the case time stood in for it.</param>
public sealed record SiteTime(string Site, double Gps, bool FromArrival);
