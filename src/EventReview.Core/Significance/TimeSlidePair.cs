namespace EventReview.Core.Significance;

/// <summary>
/// Two sites prepared for time slides on a ring. The ring covers the analysed span
/// [first segment start, last segment end) over both sites, length L ns; a trigger at GPS time t sits at
/// ring position p = t - origin in [0, L). At slide k, site B's triggers and segments move by +k x step
/// modulo L (nothing is lost at the ends; a coincidence may straddle the seam). A and B triggers are
/// coincident at slide k when the ring distance |p_A - (p_B + k step) mod L| (the shorter way round) is at
/// most the window, inclusive. Both triggers already lie in their own (moved) analysed time.
/// </summary>
public sealed class TimeSlidePair
{
    private readonly long[] _segA;
    private readonly long[] _segB;

    /// <summary>Prepares two sites (site B is the one that slides).</summary>
    /// <exception cref="ArgumentException">When both sites have the same code.</exception>
    public TimeSlidePair(SiteTriggers siteA, SiteTriggers siteB)
        : this(siteA, siteB, null)
    {
    }

    /// <summary>Prepares two sites on a ring given as (origin ns, span ns), e.g. the ring of a larger network.</summary>
    internal TimeSlidePair(SiteTriggers siteA, SiteTriggers siteB, (long OriginNs, long SpanNs)? ring)
    {
        ArgumentNullException.ThrowIfNull(siteA);
        ArgumentNullException.ThrowIfNull(siteB);
        if (string.Equals(siteA.Code, siteB.Code, StringComparison.OrdinalIgnoreCase))
        {
            throw new ArgumentException($"The two sites must differ (both are {siteA.Code}).", nameof(siteB));
        }

        SiteA = siteA;
        SiteB = siteB;
        OriginNs = ring?.OriginNs ?? Math.Min(siteA.Segments[0].Start.Nanoseconds, siteB.Segments[0].Start.Nanoseconds);
        SpanNs = ring?.SpanNs ?? (Math.Max(siteA.Segments[^1].End.Nanoseconds, siteB.Segments[^1].End.Nanoseconds) - OriginNs);
        (PositionsA, SnrSquaredA, ChirpMassA) = Columns(siteA.Triggers, OriginNs);
        (PositionsB, SnrSquaredB, ChirpMassB) = Columns(siteB.Triggers, OriginNs);
        _segA = RingOverlap.Flatten(siteA.Segments, OriginNs);
        _segB = RingOverlap.Flatten(siteB.Segments, OriginNs);
    }

    /// <summary>The fixed site.</summary>
    public SiteTriggers SiteA { get; }

    /// <summary>The sliding site.</summary>
    public SiteTriggers SiteB { get; }

    /// <summary>GPS nanoseconds of ring position 0 (the first segment start of either site).</summary>
    public long OriginNs { get; }

    /// <summary>Ring length L in ns (last segment end minus first segment start, over both sites).</summary>
    public long SpanNs { get; }

    internal long[] PositionsA { get; }

    internal long[] PositionsB { get; }

    internal double[] SnrSquaredA { get; }

    internal double[] SnrSquaredB { get; }

    internal double[] ChirpMassA { get; }

    internal double[] ChirpMassB { get; }

    /// <summary>
    /// Analysed time common to A and to B moved by <paramref name="shiftNs"/> round the ring, in ns
    /// (exact; a moved segment that crosses the seam is split in two).
    /// </summary>
    public long OverlapNanoseconds(long shiftNs) => RingOverlap.Nanoseconds(_segA, RingOverlap.Shift(_segB, shiftNs, SpanNs));

    /// <summary>Analysed time common to both sites at zero lag (no shift), in ns.</summary>
    public long ZeroLagOverlapNanoseconds() => RingOverlap.Nanoseconds(_segA, _segB);

    /// <summary>
    /// Zero-lag coincidences on the line (no ring: the seam joins instants that are not simultaneous):
    /// |t_A - t_B| &lt;= window, with the chirp-mass cut when set. Slide = 0.
    /// </summary>
    public List<SlideCoincidence> ZeroLag(TimeSlideOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var list = new List<SlideCoincidence>();
        var w = options.WindowNs;
        var tol = options.ChirpMassRelativeTolerance ?? double.NaN;
        var lo = 0;
        for (var i = 0; i < PositionsA.Length; i++)
        {
            var pa = PositionsA[i];
            while (lo < PositionsB.Length && PositionsB[lo] < pa - w)
            {
                lo++;
            }

            for (var j = lo; j < PositionsB.Length && PositionsB[j] <= pa + w; j++)
            {
                if (ChirpAgreement.Agrees(ChirpMassA[i], ChirpMassB[j], tol))
                {
                    list.Add(Coincidence(0, i, j, Math.Sqrt(SnrSquaredA[i] + SnrSquaredB[j])));
                }
            }
        }

        return list;
    }

    /// <summary>Builds the full description of a coincidence from trigger indices (into the sorted trigger lists).</summary>
    public SlideCoincidence Coincidence(int slide, int indexA, int indexB, double statistic) => new(
        slide,
        indexA,
        indexB,
        SiteA.Triggers[indexA].Time.Nanoseconds,
        SiteB.Triggers[indexB].Time.Nanoseconds,
        statistic);

    private static (long[] Positions, double[] SnrSquared, double[] ChirpMass) Columns(IReadOnlyList<Trigger> triggers, long origin)
    {
        var n = triggers.Count;
        var positions = new long[n];
        var snr2 = new double[n];
        var chirp = new double[n];
        for (var i = 0; i < n; i++)
        {
            var t = triggers[i];
            positions[i] = t.Time.Nanoseconds - origin;
            snr2[i] = t.Snr * t.Snr;
            chirp[i] = t.ChirpMass ?? double.NaN;
        }

        return (positions, snr2, chirp);
    }
}
