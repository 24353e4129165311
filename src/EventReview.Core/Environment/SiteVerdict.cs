using EventReview.Core.Verdicts;

namespace EventReview.Core.Environment;

/// <summary>Verdict of one site.</summary>
/// <param name="Site">Site code.</param>
/// <param name="Gps">Time looked up, GPS seconds.</param>
/// <param name="FromArrival">True when the site's arrival time was used; false when the case time stood in.</param>
/// <param name="Judgement">"clear" or "concern" with the reason in one sentence.</param>
/// <param name="Reasons">Each thing that makes the site a concern (empty when clear).</param>
public sealed record SiteVerdict(string Site, double Gps, bool FromArrival, Judgement Judgement, IReadOnlyList<string> Reasons);
