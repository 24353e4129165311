using EventReview.Core.Verdicts;

namespace EventReview.Core.Significance;

/// <summary>The background of one site pair with its verdict.</summary>
/// <param name="Plan">Window and candidate statistic used, with their origin.</param>
/// <param name="Result">The time-slide result (curve decimated for storage; every figure as computed).</param>
/// <param name="Band">The significance band as a word (<see cref="SignificanceBand.Word"/>).</param>
/// <param name="MaxReachableSigma">The largest sigma this background time could give (nothing as loud at all).</param>
/// <param name="Judgement">The pair's band, or a concern when its background is too short, with the numbers.</param>
/// <param name="ElapsedSeconds">Wall time of the pair's search in s (informational).</param>
public sealed record BackgroundPairOutcome(BackgroundPairPlan Plan, BackgroundResult Result, string Band, double MaxReachableSigma, Judgement Judgement, double ElapsedSeconds);
