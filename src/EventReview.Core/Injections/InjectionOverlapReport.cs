using EventReview.Core.Verdicts;

namespace EventReview.Core.Injections;

/// <summary>Result of looking up injections around a candidate at every site.</summary>
/// <param name="Hits">Every overlapping injection, any status, sorted by site and start.</param>
/// <param name="SitesChecked">Sites looked up with the GPS time used for each (arrival, or the case time when no arrival was given).</param>
/// <param name="MarginSeconds">Margin added on both sides of each injection span.</param>
/// <param name="Judgement">"concern" when a performed or scheduled injection overlaps; otherwise "clear" (aborted ones are listed only), with the reason.</param>
/// <param name="Assumptions">Plain statements of what the lookup assumed.</param>
public sealed record InjectionOverlapReport(
    IReadOnlyList<InjectionOverlapHit> Hits,
    IReadOnlyList<SiteTime> SitesChecked,
    double MarginSeconds,
    Judgement Judgement,
    IReadOnlyList<string> Assumptions);
