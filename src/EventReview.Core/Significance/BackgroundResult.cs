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

    /// <summary>False-alarm rate in Hz (Louder / BackgroundSeconds, or the 90 % upper bound 2.3026 / BackgroundSeconds).</summary>
    public required double FarHz { get; init; }

    /// <summary>True when no background coincidence was as loud and FarHz is an upper bound.</summary>
    public required bool FarIsBound { get; init; }

    /// <summary>Confidence level of the FAR bound (0.9), or null when the FAR is measured.</summary>
    public double? FarBoundConfidence { get; init; }

    /// <summary>False-alarm probability 1 - exp(-FAR T_obs); an upper bound when <see cref="FapIsBound"/>.</summary>
    public required double Fap { get; init; }

    /// <summary>True when the FAP is an upper bound (nothing as loud in the background).</summary>
    public bool FapIsBound => FarIsBound;

    /// <summary>One-sided Gaussian significance of Fap (0 when Fap &gt;= 0.5); a lower bound when <see cref="SigmaIsBound"/>.</summary>
    public required double Sigma { get; init; }

    /// <summary>True when the sigma is a lower bound.</summary>
    public bool SigmaIsBound => FarIsBound;

    /// <summary>Slides with at least one background coincidence as loud as the candidate (m).</summary>
    public int SlidesWithLouder { get; init; }

    /// <summary>
    /// Empirical p-value over slides, (m + 1) / (2K + 1) (North, Curtis and Sham 2002, Am. J. Hum. Genet. 71, 439): each slide is
    /// one background realisation of the analysed time. Its floor 1 / (2K + 1) is reached when m = 0, and is then an upper bound.
    /// </summary>
    public double SlidePValue { get; init; }

    /// <summary>True when no slide had a louder coincidence, so <see cref="SlidePValue"/> is only the floor (an upper bound, "≤").</summary>
    public bool SlidePValueIsFloor => SlidesWithLouder == 0;

    /// <summary>Background coincidences at least as loud as <see cref="TimeSlideOptions.JointStatistic"/> (for combining with other coincidence types); 0 when none was given.</summary>
    public long LouderThanJoint { get; init; }

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
