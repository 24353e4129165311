using EventReview.Core.Verdicts;

namespace EventReview.Core.Environment;

/// <summary>Result of the environment and veto lookup for one case.</summary>
/// <param name="CaseGps">Case GPS time, seconds.</param>
/// <param name="Hits">Every trigger inside a site window, sorted by site, offset.</param>
/// <param name="Segments">Every data-quality segment active inside a site window.</param>
/// <param name="Coincidences">Same-kind hits at different sites within the light-travel window.</param>
/// <param name="Sites">Per-site verdicts.</param>
/// <param name="Judgement">"concern" when any site is of concern, otherwise "clear", with the reason. The verdict flags; people decide.</param>
/// <param name="Warnings">Problems with the inputs found during the lookup (e.g. a hit outside observing segments).</param>
/// <param name="Assumptions">Windows, rate model, coupling model and thresholds used, in words.</param>
public sealed record EnvironmentReport(
    double CaseGps,
    IReadOnlyList<EnvironmentHit> Hits,
    IReadOnlyList<ActiveSegment> Segments,
    IReadOnlyList<CrossSiteCoincidence> Coincidences,
    IReadOnlyList<SiteVerdict> Sites,
    Judgement Judgement,
    IReadOnlyList<string> Warnings,
    IReadOnlyList<string> Assumptions);
