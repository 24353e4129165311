using EventReview.Core.Verdicts;

namespace EventReview.Core.Significance;

/// <summary>Joint significance over coincidence types (see <see cref="JointSignificance"/>).</summary>
/// <param name="CandidateStatistic">The candidate's ranking statistic the types were counted at.</param>
/// <param name="Types">Each type's contribution.</param>
/// <param name="Figures">Joint FAR (sum), FAP and sigma; bounds when any type's rate is a bound.</param>
/// <param name="ExpectedFalseAlarms">Sum over types of FAR x observing time.</param>
/// <param name="Judgement">The significance band, with the numbers.</param>
/// <param name="Assumptions">The combination rule and its source, in words.</param>
public sealed record JointSignificanceResult(double CandidateStatistic, IReadOnlyList<JointTypeContribution> Types, SignificanceFigures Figures,
    double ExpectedFalseAlarms, Judgement Judgement, IReadOnlyList<string> Assumptions);
