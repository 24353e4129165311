using EventReview.Core.Significance;

namespace EventReview.Web.Services.Checks;

/// <summary>The stored background of one site pair.</summary>
/// <param name="Plan">Window and candidate statistic used, with their origin.</param>
/// <param name="Result">The Core result (curve decimated for storage; every figure as computed).</param>
/// <param name="Band">"≥ 5σ", "3–5σ" or "&lt; 3σ" (a lower bound on sigma when the FAR is a bound).</param>
/// <param name="MaxReachableSigma">The largest sigma this background time could give (no louder background at all): Q⁻¹(1 − exp(−T_obs / T_bg)).</param>
/// <param name="Verdict">"consistent" (figures computed with enough background time) or "concern".</param>
/// <param name="VerdictReason">Why, in plain words.</param>
/// <param name="ElapsedSeconds">Wall time of the pair's search in s (informational).</param>
public sealed record BackgroundPairRecord(BackgroundPairPlan Plan, BackgroundResult Result, string Band, double MaxReachableSigma, string Verdict, string VerdictReason, double ElapsedSeconds);
