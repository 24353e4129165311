using EventReview.Core.Verdicts;

namespace EventReview.Core.Significance;

/// <summary>The background check of a candidate: every site pair, and for three sites the triple and the joint significance.</summary>
/// <param name="Pairs">Per site pair, the background and its verdict.</param>
/// <param name="Triple">The three-site background (exactly three sites), or null.</param>
/// <param name="TripleStatisticRule">Where the triple's statistic came from, or null.</param>
/// <param name="Joint">Pairs and triple combined (see <see cref="JointSignificance"/>), or null.</param>
/// <param name="HeadlinePair">Index in <paramref name="Pairs"/> of the least significant pair (largest FAR), quoted when there is no joint figure.</param>
/// <param name="Judgement">The verdict: the joint band for three sites, else the least significant pair's band; a concern when a background is too short.</param>
/// <param name="Method">How the numbers were made, with the method's sources.</param>
/// <param name="Notes">What could not be done and why (for example no zero-lag triple), or empty.</param>
public sealed record BackgroundCheckResult(
    IReadOnlyList<BackgroundPairOutcome> Pairs,
    TripleBackgroundResult? Triple,
    string? TripleStatisticRule,
    JointSignificanceResult? Joint,
    int HeadlinePair,
    Judgement Judgement,
    IReadOnlyList<string> Method,
    IReadOnlyList<string> Notes);
