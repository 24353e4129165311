namespace EventReview.Core.Significance;

/// <summary>
/// Background of three-site coincidences ranked on all three sites. A triple at slide k is three triggers,
/// one per site, with the second site moved by k x step and the third by 2k x step round the common ring,
/// whose three pairwise ring distances are all within the window. Plain data (camelCase JSON).
/// </summary>
/// <param name="Sites">The three site codes in order (the first is fixed).</param>
/// <param name="Slides">2K.</param>
/// <param name="BackgroundSeconds">Sum over slides of the time all three sites analysed after the shifts, in s.</param>
/// <param name="CandidateStatistic">Three-site network SNR of the candidate.</param>
/// <param name="Figures">Background count, louder count, FAR, FAP and sigma.</param>
/// <param name="ObservingTimeSeconds">T_obs in s (default: zero-lag triple-coincident analysed time).</param>
/// <param name="ZeroLagTriples">Number of zero-lag triples.</param>
/// <param name="Loudest">Loudest background triples, loudest first.</param>
/// <param name="Assumptions">How the numbers were obtained.</param>
public sealed record TripleBackgroundResult(
    IReadOnlyList<string> Sites,
    int Slides,
    double BackgroundSeconds,
    double CandidateStatistic,
    SignificanceFigures Figures,
    double ObservingTimeSeconds,
    long ZeroLagTriples,
    IReadOnlyList<TripleCoincidence> Loudest,
    IReadOnlyList<string> Assumptions)
{
    /// <summary>Windows of the three pairs in ms: first-second, first-third, second-third.</summary>
    public IReadOnlyList<double> WindowsMs { get; init; } = [];

    /// <summary>The figures without any background triple that uses one of the candidate's own triggers; null when not asked for.</summary>
    public SignificanceFigures? WithoutCandidateTriggers { get; init; }

    /// <summary>The zero-lag triple taken as the candidate, if any.</summary>
    public TripleCoincidence? Candidate { get; init; }

    /// <summary>Slides with at least one background triple as loud as the candidate.</summary>
    public int SlidesWithLouder { get; init; }

    /// <summary>Empirical p-value over slides (m + 1) / (2K + 1); its floor is an upper bound.</summary>
    public double SlidePValue { get; init; }

    /// <summary>True when the slide p-value is only the floor 1 / (2K + 1).</summary>
    public bool SlidePValueIsFloor => SlidesWithLouder == 0;

    /// <summary>The largest sigma this background time could give over the observing time (nothing as loud at all).</summary>
    public double MaxReachableSigma => SignificanceBand.MaxReachableSigma(BackgroundSeconds, ObservingTimeSeconds);

    /// <summary>Time all three sites analysed at zero lag, s.</summary>
    public double ZeroLagSeconds { get; init; }
}
