namespace EventReview.Core.Significance;

/// <summary>
/// Streams background coincidences into counts, a histogram of the ranking statistic and the loudest N,
/// without keeping them all (a month of triggers can give ~1e8 background coincidences).
/// </summary>
public sealed class BackgroundAccumulator : ICoincidenceSink<BackgroundAccumulator>
{
    private const int MaxBins = 1 << 22;
    private readonly double _threshold;
    private readonly double _extraThreshold;
    private readonly double _lowest;
    private readonly HashSet<int> _slidesLouder = [];
    private readonly HashSet<int> _slidesLouderWithout = [];
    private readonly int _candidateA;
    private readonly int _candidateB;
    private readonly double _binWidth;
    private readonly double _inverseBinWidth;
    private readonly int _keep;
    private readonly PriorityQueue<(int Slide, int IndexA, int IndexB, double Statistic), double> _loudest = new();
    private long[] _histogram = new long[4096];
    private double _floor;

    /// <summary>Creates an empty accumulator.</summary>
    /// <param name="candidateStatistic">Coincidences with statistic &gt;= this are counted as louder.</param>
    /// <param name="binWidth">Histogram bin width in units of the statistic (bins start at 0).</param>
    /// <param name="keepLoudest">How many of the loudest coincidences to keep.</param>
    /// <param name="candidateIndexA">Site-A trigger of the candidate, or -1.</param>
    /// <param name="candidateIndexB">Site-B trigger of the candidate, or -1.</param>
    /// <param name="extraThreshold">A second statistic to count louder coincidences against (for example a three-site
    /// candidate's, when this pair's background is combined with others), or +infinity for none.</param>
    public BackgroundAccumulator(double candidateStatistic, double binWidth, int keepLoudest, int candidateIndexA = -1, int candidateIndexB = -1,
        double extraThreshold = double.PositiveInfinity)
    {
        _threshold = candidateStatistic;
        _extraThreshold = extraThreshold;
        _lowest = Math.Min(candidateStatistic, extraThreshold);
        _binWidth = binWidth;
        _inverseBinWidth = 1.0 / binWidth;
        _keep = keepLoudest;
        _candidateA = candidateIndexA;
        _candidateB = candidateIndexB;
        _floor = keepLoudest == 0 ? double.PositiveInfinity : double.NegativeInfinity;
    }

    /// <summary>All background coincidences received.</summary>
    public long Count { get; private set; }

    /// <summary>Those with statistic &gt;= the candidate's.</summary>
    public long Louder { get; private set; }

    /// <summary>Those with statistic &gt;= the extra threshold.</summary>
    public long LouderThanExtra { get; private set; }

    /// <summary>Slides with at least one coincidence as loud as the candidate.</summary>
    public int SlidesWithLouder => _slidesLouder.Count;

    /// <summary>Slides with at least one such coincidence that uses none of the candidate's triggers.</summary>
    public int SlidesWithLouderWithoutCandidateTriggers => _slidesLouderWithout.Count;

    /// <summary>Coincidences that use one of the candidate's own triggers.</summary>
    public long CountWithCandidateTriggers { get; private set; }

    /// <summary>Louder coincidences that use one of the candidate's own triggers.</summary>
    public long LouderWithCandidateTriggers { get; private set; }

    /// <summary>Histogram bin width.</summary>
    public double BinWidth => _binWidth;

    /// <summary>Counts per bin [i w, (i+1) w); the last bin also holds everything above it.</summary>
    public IReadOnlyList<long> Histogram => _histogram;

    /// <summary>The loudest coincidences kept, loudest first: (slide, A index, B index, statistic).</summary>
    public IReadOnlyList<(int Slide, int IndexA, int IndexB, double Statistic)> Loudest() =>
        [.. _loudest.UnorderedItems.Select(x => x.Element).OrderByDescending(x => x.Statistic).ThenBy(x => x.Slide).ThenBy(x => x.IndexA)];

    /// <inheritdoc />
    public void AddBatch(ReadOnlySpan<FoundCoincidence> batch)
    {
        if (_candidateA >= 0 || _candidateB >= 0)
        {
            foreach (var c in batch)
            {
                Add(c.Slide, c.IndexA, c.IndexB, c.Statistic);
            }

            return;
        }

        // the common case, kept tight: counts, histogram and the loudest-N floor in locals
        long louder = 0;
        var threshold = _threshold;
        var lowest = _lowest;
        var inverse = _inverseBinWidth;
        var hist = _histogram;
        foreach (var c in batch)
        {
            var stat = c.Statistic;
            if (stat >= lowest)
            {
                Loud(c.Slide, stat, threshold, ref louder);
            }

            var bin = stat * inverse;
            var i = bin < MaxBins - 1 ? (int)bin : MaxBins - 1;
            if ((uint)i >= (uint)hist.Length)
            {
                Array.Resize(ref _histogram, Math.Min(MaxBins, Math.Max(i + 1, hist.Length * 2)));
                hist = _histogram;
            }

            hist[i]++;
            if (stat > _floor || _loudest.Count < _keep)
            {
                Offer(c.Slide, c.IndexA, c.IndexB, stat);
            }
        }

        Count += batch.Length;
        Louder += louder;
    }

    /// <inheritdoc />
    public void Add(int slide, int indexA, int indexB, double statistic)
    {
        Count++;
        var louder = statistic >= _threshold;
        if (statistic >= _lowest)
        {
            long counted = 0;
            Loud(slide, statistic, _threshold, ref counted);
            Louder += counted;
        }

        if (indexA == _candidateA || indexB == _candidateB)
        {
            CountWithCandidateTriggers++;
            if (louder)
            {
                LouderWithCandidateTriggers++;
            }
        }
        else if (louder)
        {
            _slidesLouderWithout.Add(slide);
        }

        var bin = statistic * _inverseBinWidth;
        var i = bin < MaxBins - 1 ? (int)bin : MaxBins - 1;
        if (i >= _histogram.Length)
        {
            Array.Resize(ref _histogram, Math.Min(MaxBins, Math.Max(i + 1, _histogram.Length * 2)));
        }

        _histogram[i]++;
        if (statistic > _floor || _loudest.Count < _keep)
        {
            Offer(slide, indexA, indexB, statistic);
        }
    }

    /// <inheritdoc />
    public BackgroundAccumulator CreatePart() => new(_threshold, _binWidth, _keep, _candidateA, _candidateB, _extraThreshold);

    /// <inheritdoc />
    public void Merge(BackgroundAccumulator part)
    {
        ArgumentNullException.ThrowIfNull(part);
        Count += part.Count;
        Louder += part.Louder;
        LouderThanExtra += part.LouderThanExtra;
        _slidesLouder.UnionWith(part._slidesLouder);
        _slidesLouderWithout.UnionWith(part._slidesLouderWithout);
        CountWithCandidateTriggers += part.CountWithCandidateTriggers;
        LouderWithCandidateTriggers += part.LouderWithCandidateTriggers;
        if (part._histogram.Length > _histogram.Length)
        {
            Array.Resize(ref _histogram, part._histogram.Length);
        }

        for (var i = 0; i < part._histogram.Length; i++)
        {
            _histogram[i] += part._histogram[i];
        }

        foreach (var (e, _) in part._loudest.UnorderedItems)
        {
            Offer(e.Slide, e.IndexA, e.IndexB, e.Statistic);
        }
    }

    private void Loud(int slide, double statistic, double threshold, ref long louder)
    {
        if (statistic >= threshold)
        {
            louder++;
            _slidesLouder.Add(slide);
        }

        if (statistic >= _extraThreshold)
        {
            LouderThanExtra++;
        }
    }

    private void Offer(int slide, int indexA, int indexB, double statistic)
    {
        if (_keep == 0)
        {
            return;
        }

        if (_loudest.Count < _keep)
        {
            _loudest.Enqueue((slide, indexA, indexB, statistic), statistic);
        }
        else if (statistic > _loudest.Peek().Statistic)
        {
            _loudest.EnqueueDequeue((slide, indexA, indexB, statistic), statistic);
        }

        if (_loudest.Count == _keep)
        {
            _floor = _loudest.Peek().Statistic;
        }
    }
}
