namespace EventReview.Core.Significance;

/// <summary>
/// The time-slide background of a two-site candidate and its false-alarm figures. Plain data: serialises
/// to camelCase JSON with System.Text.Json. Times in s unless named Ns (GPS nanoseconds).
/// </summary>
public sealed record BackgroundResult
{
    /// <summary>Code of the fixed site.</summary>
    public required string SiteA { get; init; }

    /// <summary>Code of the sliding site.</summary>
    public required string SiteB { get; init; }

    /// <summary>Finder used ("fast" or "naive"); both give the same coincidences.</summary>
    public required string Algorithm { get; init; }

    /// <summary>Number of slides, 2K.</summary>
    public required int Slides { get; init; }

    /// <summary>K: slides k = ±1..±K.</summary>
    public required int MaxSlide { get; init; }

    /// <summary>Coincidence window (±, inclusive) in s.</summary>
    public required double WindowSeconds { get; init; }

    /// <summary>Slide step in s.</summary>
    public required double StepSeconds { get; init; }

    /// <summary>GPS ns where the ring starts (first segment start).</summary>
    public required long RingStartNs { get; init; }

    /// <summary>Ring length (analysed span) in s.</summary>
    public required double SpanSeconds { get; init; }

    /// <summary>Total background time in s: sum over slides of the overlap of the analysed times after the shift.</summary>
    public required double BackgroundSeconds { get; init; }

    /// <summary>Analysed time common to both sites at zero lag, in s.</summary>
    public required double ZeroLagCoincidentSeconds { get; init; }

    /// <summary>Observing time T_obs used for the false-alarm probability, in s.</summary>
    public required double ObservingTimeSeconds { get; init; }

    /// <summary>Ranking statistic of the candidate.</summary>
    public required double CandidateStatistic { get; init; }

    /// <summary>All background coincidences (zero lag excluded).</summary>
    public required long BackgroundCoincidences { get; init; }

    /// <summary>Background coincidences with statistic &gt;= the candidate's.</summary>
    public required long Louder { get; init; }

    /// <summary>False-alarm rate in Hz (Louder / BackgroundSeconds, or the bound 1 / BackgroundSeconds).</summary>
    public required double FarHz { get; init; }

    /// <summary>True when no background coincidence was as loud and FarHz is an upper bound.</summary>
    public required bool FarIsBound { get; init; }

    /// <summary>False-alarm probability 1 - exp(-FAR T_obs).</summary>
    public required double Fap { get; init; }

    /// <summary>One-sided Gaussian significance of Fap (0 when Fap &gt;= 0.5).</summary>
    public required double Sigma { get; init; }

    /// <summary>The same figures with every background coincidence that uses one of the candidate's triggers removed; null when not asked for or no candidate was found.</summary>
    public SignificanceFigures? WithoutCandidateTriggers { get; init; }

    /// <summary>The zero-lag coincidence taken as the candidate (for trigger removal), if any.</summary>
    public BackgroundCoincidence? Candidate { get; init; }

    /// <summary>Cumulative background rate vs ranking statistic, by increasing statistic, at most ~500 points spread evenly in log(count).</summary>
    public required IReadOnlyList<BackgroundCurvePoint> Curve { get; init; }

    /// <summary>The loudest background coincidences, loudest first.</summary>
    public required IReadOnlyList<BackgroundCoincidence> Loudest { get; init; }

    /// <summary>Number of zero-lag coincidences.</summary>
    public required long ZeroLagCoincidences { get; init; }

    /// <summary>The loudest zero-lag coincidences, loudest first.</summary>
    public required IReadOnlyList<BackgroundCoincidence> ZeroLag { get; init; }

    /// <summary>Site A triggers dropped for lying outside its segments.</summary>
    public required int DroppedTriggersA { get; init; }

    /// <summary>Site B triggers dropped for lying outside its segments.</summary>
    public required int DroppedTriggersB { get; init; }

    /// <summary>How the numbers were obtained: window, step, slides, background time, conventions.</summary>
    public required IReadOnlyList<string> Assumptions { get; init; }
}
