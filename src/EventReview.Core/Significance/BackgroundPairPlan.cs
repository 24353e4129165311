namespace EventReview.Core.Significance;

/// <summary>How one site pair will be analysed: the window and the candidate's statistic, with where each came from.</summary>
/// <param name="SiteA">Fixed site (first by code).</param>
/// <param name="SiteB">Sliding site.</param>
/// <param name="LightTravelMs">Light-travel time between the sites in ms (null when a site is not in the network).</param>
/// <param name="WindowMs">Coincidence window ± in ms used for the pair.</param>
/// <param name="WindowRule">Where the window came from ("light-travel 21.3 ms + tolerance 5 ms", or "given").</param>
/// <param name="CandidateStatistic">Candidate's ranking statistic (network SNR) for the pair; null: the zero-lag coincidence nearest the candidate time.</param>
/// <param name="CandidateStatisticRule">Where it came from ("√(12.8² + 14.7²) from the case's arrivals", or "given").</param>
public sealed record BackgroundPairPlan(string SiteA, string SiteB, double? LightTravelMs, double WindowMs, string WindowRule, double? CandidateStatistic, string CandidateStatisticRule)
{
    /// <summary>"AB–KP".</summary>
    public string Name => $"{SiteA}–{SiteB}";
}
