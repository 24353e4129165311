using EventReview.Core.Time;

namespace EventReview.Core.Significance;

/// <summary>
/// Parameters of a time-slide background estimate. Times are whole nanoseconds so that the window edge,
/// segment edges and the ring seam are decided exactly.
/// </summary>
public sealed record TimeSlideOptions
{
    /// <summary>Coincidence window W in ns: two triggers are coincident when their times differ by at most W (inclusive); light-travel time plus timing tolerance. &gt;= 0.</summary>
    public required long WindowNs { get; init; }

    /// <summary>Slide step in ns; must exceed 2 W so that a pair of triggers can meet in at most one slide.</summary>
    public required long StepNs { get; init; }

    /// <summary>K: slides k = -K..-1 and 1..K are used (2K slides); zero lag is never background. &gt;= 1.</summary>
    public required int Slides { get; init; }

    /// <summary>Ranking statistic of the candidate; background coincidences with statistic &gt;= this are "louder".</summary>
    public double CandidateStatistic { get; init; } = double.PositiveInfinity;

    /// <summary>A second ranking statistic (a three-site candidate's) against which louder background coincidences are also counted, for combining coincidence types; +infinity for none.</summary>
    public double JointStatistic { get; init; } = double.PositiveInfinity;

    /// <summary>Observing time for the false-alarm probability, in s; null means the zero-lag coincident analysed time.</summary>
    public double? ObservingTimeSeconds { get; init; }

    /// <summary>Optional chirp-mass agreement cut: |m1 - m2| &lt;= tol x (m1 + m2) / 2, applied only when both triggers carry a chirp mass; null = no cut.</summary>
    public double? ChirpMassRelativeTolerance { get; init; }

    /// <summary>When true, also report the figures with every background coincidence that uses one of the candidate's own triggers removed.</summary>
    public bool RemoveCandidateTriggers { get; init; }

    /// <summary>Time of the candidate (any of its triggers' times); the zero-lag coincidence nearest to it is the candidate. Null: the loudest zero-lag coincidence.</summary>
    public GpsTime? CandidateTime { get; init; }

    /// <summary>Number of loudest background coincidences (and zero-lag coincidences) kept in the result.</summary>
    public int LoudestCount { get; init; } = 100;

    /// <summary>Bin width of the ranking statistic in the cumulative background curve (the count is exact at every bin edge).</summary>
    public double CurveBinWidth { get; init; } = 0.01;

    /// <summary>Which coincidence finder to use.</summary>
    public TimeSlideAlgorithm Algorithm { get; init; } = TimeSlideAlgorithm.Fast;

    /// <summary>Convenience constructor from a window in milliseconds and a step in seconds.</summary>
    public static TimeSlideOptions Create(double windowMilliseconds, double stepSeconds, int slides) => new()
    {
        WindowNs = (long)Math.Round(windowMilliseconds * 1e6),
        StepNs = (long)Math.Round(stepSeconds * GpsTime.NanosecondsPerSecond),
        Slides = slides,
    };

    /// <summary>
    /// Checks the options against a ring span L (ns): W &gt;= 0, step &gt; 2W, K &gt;= 1 and
    /// 2 (maxShiftFactor K step + W) &lt; L, so that no slide aliases onto another or onto zero lag.
    /// </summary>
    /// <param name="spanNs">Ring span L in ns.</param>
    /// <param name="maxShiftFactor">Largest multiple of k x step that any site is shifted by (1 for pairs, 2 for triples).</param>
    /// <exception cref="ArgumentOutOfRangeException">Naming the field that is out of range.</exception>
    public void Validate(long spanNs, int maxShiftFactor = 1)
    {
        if (WindowNs < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(WindowNs), WindowNs, "The coincidence window must not be negative.");
        }

        if (StepNs <= 2 * WindowNs)
        {
            throw new ArgumentOutOfRangeException(nameof(StepNs), StepNs, "The slide step must be longer than twice the coincidence window.");
        }

        if (Slides < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(Slides), Slides, "At least one slide (K >= 1) is needed.");
        }

        if (!(CurveBinWidth > 0) || !double.IsFinite(CurveBinWidth))
        {
            throw new ArgumentOutOfRangeException(nameof(CurveBinWidth), CurveBinWidth, "A positive bin width was expected.");
        }

        if (LoudestCount < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(LoudestCount), LoudestCount, "A non-negative count was expected.");
        }

        if (ChirpMassRelativeTolerance is { } tol && !(tol >= 0))
        {
            throw new ArgumentOutOfRangeException(nameof(ChirpMassRelativeTolerance), tol, "A non-negative relative tolerance was expected.");
        }

        if (ObservingTimeSeconds is { } tObs && !(tObs > 0 && double.IsFinite(tObs)))
        {
            throw new ArgumentOutOfRangeException(nameof(ObservingTimeSeconds), tObs, "A positive, finite observing time was expected.");
        }

        var reach = (decimal)Slides * StepNs * maxShiftFactor + WindowNs;
        if (2 * reach >= spanNs)
        {
            throw new ArgumentOutOfRangeException(
                nameof(Slides),
                Slides,
                $"The largest shift ({maxShiftFactor} x K x step + window = {reach / 1e9m} s) must be less than half the analysed span ({spanNs / 1e9} s), so that no slide wraps onto another.");
        }
    }
}
