namespace EventReview.Core.Environment;

/// <summary>Verdict of one site.</summary>
/// <param name="Site">Site code.</param>
/// <param name="Gps">Time looked up, GPS seconds.</param>
/// <param name="FromArrival">True when the site's arrival time was used; false when the case time stood in.</param>
/// <param name="Verdict">"clear" or "concern".</param>
/// <param name="Reasons">Why the verdict is "concern" (empty when clear).</param>
public sealed record SiteVerdict(string Site, double Gps, bool FromArrival, string Verdict, IReadOnlyList<string> Reasons);
