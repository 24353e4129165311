using System.Globalization;

namespace EventReview.Core.Significance;

/// <summary>
/// Time-slide background of three-site coincidences ranked on all three sites. At slide k the second
/// site moves by k x step and the third by 2k x step round a ring over all three sites' analysed span, so
/// every pair of sites is slid against every other (by k, 2k and k steps). A triple is a coincidence of the
/// first two sites found by <see cref="FastTimeSlides"/> plus a third-site trigger within the window of each of them
/// (ring distances, inclusive; each pair of sites may have its own window, from its own light-travel time); its
/// statistic is sqrt(rho1^2 + rho2^2 + rho3^2).
/// </summary>
public static class TripleTimeSlides
{
    /// <summary>Runs the three-site background.</summary>
    /// <param name="first">The fixed site.</param>
    /// <param name="second">Moves by k x step.</param>
    /// <param name="third">Moves by 2k x step.</param>
    /// <param name="options">Window, step, K (2 (2K step + W) must be below the span), candidate statistic
    /// (when not finite: the loudest zero-lag triple), observing time, chirp-mass cut, loudest count.</param>
    /// <param name="progress">Optional progress of the underlying pair search.</param>
    /// <param name="cancellationToken">Cancels the search.</param>
    /// <param name="windows">Windows per pair of sites; null uses <see cref="TimeSlideOptions.WindowNs"/> for all three.
    /// When given, its first-second window replaces the options' window.</param>
    public static TripleBackgroundResult Run(
        SiteTriggers first,
        SiteTriggers second,
        SiteTriggers third,
        TimeSlideOptions options,
        IProgress<BackgroundProgress>? progress = null,
        TripleWindows? windows = null,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(first);
        ArgumentNullException.ThrowIfNull(second);
        ArgumentNullException.ThrowIfNull(third);
        ArgumentNullException.ThrowIfNull(options);
        windows ??= new TripleWindows(options.WindowNs, options.WindowNs, options.WindowNs);
        options = options with { WindowNs = windows.FirstSecondNs };
        SiteTriggers[] sites = [first, second, third];
        var origin = sites.Min(s => s.Segments[0].Start.Nanoseconds);
        var span = sites.Max(s => s.Segments[^1].End.Nanoseconds) - origin;
        (options with { WindowNs = windows.LargestNs }).Validate(span, maxShiftFactor: 2);
        if (windows.FirstThirdNs < 0 || windows.SecondThirdNs < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(windows), windows, "The coincidence windows must not be negative.");
        }

        var pair = new TimeSlidePair(first, second, (origin, span));
        var context = new TripleContext(pair, third, options, windows);

        var zeroLag = new List<(int A, int B, int C, double Stat)>();
        foreach (var ab in pair.ZeroLag(options))
        {
            context.Partners(ab.IndexA, ab.IndexB, 0, ring: false, (c, stat) => zeroLag.Add((ab.IndexA, ab.IndexB, c, stat)));
        }

        (int A, int B, int C, double Stat)? candidate = zeroLag.Count == 0 ? null
            : options.CandidateTime is { } ct ? zeroLag.MinBy(z => Distance(context, z.A, z.B, z.C, ct.Nanoseconds))
            : zeroLag.MaxBy(z => z.Stat);
        var threshold = double.IsFinite(options.CandidateStatistic)
            ? options.CandidateStatistic
            : candidate?.Stat ?? throw new ArgumentException("No candidate statistic was given and there is no zero-lag triple to take it from.", nameof(options));
        var remove = options.RemoveCandidateTriggers && candidate is not null;
        var sink = new TripleSink(context, threshold, remove ? (candidate!.Value.A, candidate.Value.B, candidate.Value.C) : (-1, -1, -1));
        FastTimeSlides.Find(pair, options, sink, progress, cancellationToken);

        var segA = RingOverlap.Flatten(first.Segments, origin);
        var segB = RingOverlap.Flatten(second.Segments, origin);
        var segC = RingOverlap.Flatten(third.Segments, origin);
        long backgroundNs = 0;
        for (var k = -options.Slides; k <= options.Slides; k++)
        {
            if (k != 0)
            {
                var ab = RingOverlap.Intersect(segA, RingOverlap.Shift(segB, k * options.StepNs, span));
                backgroundNs += RingOverlap.Nanoseconds(ab, RingOverlap.Shift(segC, 2L * k * options.StepNs, span));
            }
        }

        var zeroLagSeconds = RingOverlap.Nanoseconds(RingOverlap.Intersect(segA, segB), segC) / 1e9;
        var observing = options.ObservingTimeSeconds ?? zeroLagSeconds;
        var backgroundSeconds = backgroundNs / 1e9;
        var figures = SignificanceFigures.Compute(sink.Count, sink.Louder, backgroundSeconds, observing);
        var without = remove ? SignificanceFigures.Compute(sink.Count - sink.CountWithCandidate, sink.Louder - sink.LouderWithCandidate, backgroundSeconds, observing) : null;
        var inv = CultureInfo.InvariantCulture;
        var codes = new[] { first.Code, second.Code, third.Code };
        return new TripleBackgroundResult(
            codes,
            2 * options.Slides,
            backgroundSeconds,
            threshold,
            figures,
            observing,
            zeroLag.Count,
            sink.Loudest(),
            new[]
            {
                string.Create(inv, $"Triple: one trigger per site, pairwise time differences within ±{windows.FirstSecondNs / 1e6:G9} ms ({first.Code}-{second.Code}), ±{windows.FirstThirdNs / 1e6:G9} ms ({first.Code}-{third.Code}) and ±{windows.SecondThirdNs / 1e6:G9} ms ({second.Code}-{third.Code}) (ring distance, inclusive); statistic sqrt(sum of the three squared SNRs)."),
                string.Create(inv, $"Slides k = ±1..±{options.Slides}: {second.Code} moved by k x {options.StepNs / 1e9:G9} s and {third.Code} by 2k x step on a ring over the three sites' span ({span / 1e9:G9} s)."),
                "Background time: for each slide, the time all three sites analysed after the shifts, exact on the ring; summed over slides.",
                string.Create(inv, $"FAP over T_obs = {observing:G9} s; when nothing is as loud, the FAR is the 90 % upper bound 2.3026 / background time (Gehrels 1986) and the sigma a lower bound; sigma one-sided Gaussian."),
                remove ? "Also reported: the figures without any background triple that uses one of the candidate's own triggers." : string.Empty,
            }.Where(a => a.Length > 0).ToList())
        {
            WindowsMs = [windows.FirstSecondNs / 1e6, windows.FirstThirdNs / 1e6, windows.SecondThirdNs / 1e6],
            WithoutCandidateTriggers = without,
            Candidate = candidate is { } cz ? context.Show(0, cz.A, cz.B, cz.C, cz.Stat) : null,
            SlidesWithLouder = sink.SlidesWithLouder,
            SlidePValue = (sink.SlidesWithLouder + 1.0) / ((2.0 * options.Slides) + 1),
            ZeroLagSeconds = zeroLagSeconds,
        };
    }

    private static long Distance(TripleContext context, int a, int b, int c, long t)
    {
        var p = context.Pair;
        return new[] { p.SiteA.Triggers[a].Time.Nanoseconds, p.SiteB.Triggers[b].Time.Nanoseconds, context.Third.Triggers[c].Time.Nanoseconds }.Min(x => Math.Abs(x - t));
    }

    /// <summary>Read-only data shared by the sink parts.</summary>
    internal sealed class TripleContext
    {
        private readonly long[] _posC;
        private readonly double[] _snr2C;
        private readonly double[] _chirpC;
        private readonly TimeSlidePair _pair;
        private readonly long _wAc;
        private readonly long _wBc;
        private readonly long _step;
        private readonly double _tol;

        public TripleContext(TimeSlidePair pair, SiteTriggers third, TimeSlideOptions options, TripleWindows windows)
        {
            _pair = pair;
            _posC = [.. third.Triggers.Select(t => t.Time.Nanoseconds - pair.OriginNs)];
            _snr2C = [.. third.Triggers.Select(t => t.Snr * t.Snr)];
            _chirpC = [.. third.Triggers.Select(t => t.ChirpMass ?? double.NaN)];
            _wAc = windows.FirstThirdNs;
            _wBc = windows.SecondThirdNs;
            _step = options.StepNs;
            _tol = options.ChirpMassRelativeTolerance ?? double.NaN;
            Keep = options.LoudestCount;
            Third = third;
        }

        public int Keep { get; }

        public SiteTriggers Third { get; }

        public TimeSlidePair Pair => _pair;

        /// <summary>Calls back with every third-site partner (index, statistic) of a first/second pair at slide k.</summary>
        public void Partners(int ia, int ib, int k, bool ring, Action<int, double> found)
        {
            var span = _pair.SpanNs;
            var pa = _pair.PositionsA[ia];
            var pb = _pair.PositionsB[ib];
            var center = pa - (2L * k * _step);
            if (!ring)
            {
                Scan(center - _wAc, center + _wAc);
                return;
            }

            center = RingOverlap.FloorMod(center, span);
            var lo = center - _wAc;
            var hi = center + _wAc;
            if (lo < 0)
            {
                Scan(lo + span, span - 1);
                Scan(0, hi);
            }
            else if (hi >= span)
            {
                Scan(lo, span - 1);
                Scan(0, hi - span);
            }
            else
            {
                Scan(lo, hi);
            }

            void Scan(long from, long to)
            {
                var c = LowerBound(_posC, from);
                for (; c < _posC.Length && _posC[c] <= to; c++)
                {
                    var d = pb + (k * _step) - (_posC[c] + (2L * k * _step));
                    var dist = ring ? RingDistance(d, span) : Math.Abs(d);
                    if (dist <= _wBc
                        && ChirpAgreement.Agrees(_pair.ChirpMassA[ia], _chirpC[c], _tol)
                        && ChirpAgreement.Agrees(_pair.ChirpMassB[ib], _chirpC[c], _tol))
                    {
                        found(c, Math.Sqrt(_pair.SnrSquaredA[ia] + _pair.SnrSquaredB[ib] + _snr2C[c]));
                    }
                }
            }
        }

        /// <summary>A triple for people: times and SNRs of the three triggers before any shift.</summary>
        public TripleCoincidence Show(int k, int a, int b, int c, double stat) => new(
            k,
            [_pair.SiteA.Triggers[a].Time.Nanoseconds, _pair.SiteB.Triggers[b].Time.Nanoseconds, Third.Triggers[c].Time.Nanoseconds],
            [_pair.SiteA.Triggers[a].Snr, _pair.SiteB.Triggers[b].Snr, Third.Triggers[c].Snr],
            stat);

        private static long RingDistance(long d, long span)
        {
            var r = RingOverlap.FloorMod(d, span);
            return Math.Min(r, span - r);
        }

        private static int LowerBound(long[] sorted, long value)
        {
            int lo = 0, hi = sorted.Length;
            while (lo < hi)
            {
                var mid = (lo + hi) >>> 1;
                if (sorted[mid] < value)
                {
                    lo = mid + 1;
                }
                else
                {
                    hi = mid;
                }
            }

            return lo;
        }
    }

    /// <summary>Counts triples on top of the first/second pair coincidences.</summary>
    internal sealed class TripleSink(TripleContext context, double threshold, (int A, int B, int C) candidate) : ICoincidenceSink<TripleSink>
    {
        private readonly List<(int K, int A, int B, int C, double Stat)> _loudest = [];
        private readonly HashSet<int> _slidesLouder = [];

        public long Count { get; private set; }

        public long Louder { get; private set; }

        public long CountWithCandidate { get; private set; }

        public long LouderWithCandidate { get; private set; }

        public int SlidesWithLouder => _slidesLouder.Count;

        public void Add(int slide, int indexA, int indexB, double statistic) =>
            context.Partners(indexA, indexB, slide, ring: true, (c, stat) =>
            {
                Count++;
                var louder = stat >= threshold;
                if (louder)
                {
                    Louder++;
                    _slidesLouder.Add(slide);
                }

                if (indexA == candidate.A || indexB == candidate.B || c == candidate.C)
                {
                    CountWithCandidate++;
                    if (louder)
                    {
                        LouderWithCandidate++;
                    }
                }

                Keep((slide, indexA, indexB, c, stat));
            });

        public TripleSink CreatePart() => new(context, threshold, candidate);

        public void Merge(TripleSink part)
        {
            Count += part.Count;
            Louder += part.Louder;
            CountWithCandidate += part.CountWithCandidate;
            LouderWithCandidate += part.LouderWithCandidate;
            _slidesLouder.UnionWith(part._slidesLouder);
            foreach (var t in part._loudest)
            {
                Keep(t);
            }
        }

        public List<TripleCoincidence> Loudest() =>
            [.. _loudest.OrderByDescending(t => t.Stat).Select(t => context.Show(t.K, t.A, t.B, t.C, t.Stat))];

        private void Keep((int K, int A, int B, int C, double Stat) t)
        {
            if (context.Keep == 0)
            {
                return;
            }

            if (_loudest.Count < context.Keep)
            {
                _loudest.Add(t);
                return;
            }

            var min = 0;
            for (var i = 1; i < _loudest.Count; i++)
            {
                if (_loudest[i].Stat < _loudest[min].Stat)
                {
                    min = i;
                }
            }

            if (t.Stat > _loudest[min].Stat)
            {
                _loudest[min] = t;
            }
        }
    }
}
