namespace EventReview.Core.Significance;

/// <summary>
/// The plain, obviously-correct time-slide finder, kept as the oracle for <see cref="FastTimeSlides"/>:
/// for each slide k = ±1..±K, move site B's sorted ring positions by k x step modulo L (a rotation of the
/// sorted list), then merge them against site A's positions, looking across the seam through images at
/// ±L. Work: 2K x (triggers of A + triggers of B).
/// </summary>
internal static class NaiveTimeSlides
{
    /// <summary>Sends every background coincidence of the 2K slides to the sink.</summary>
    /// <param name="pair">The two sites; B slides.</param>
    /// <param name="options">Window, step and K (validated against the ring span).</param>
    /// <param name="sink">Receives the coincidences (parts per worker thread, merged at the end).</param>
    /// <param name="progress">Optional; reported after each slide.</param>
    /// <param name="cancellationToken">Checked between slides.</param>
    public static void Find<TSink>(
        TimeSlidePair pair,
        TimeSlideOptions options,
        TSink sink,
        IProgress<BackgroundProgress>? progress = null,
        CancellationToken cancellationToken = default)
        where TSink : class, ICoincidenceSink<TSink>
    {
        ArgumentNullException.ThrowIfNull(pair);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(sink);
        options.Validate(pair.SpanNs);
        var total = 2 * options.Slides;
        long found = 0;
        var done = 0;
        Parallel.For(
            0,
            total,
            new ParallelOptions { CancellationToken = cancellationToken },
            () =>
            {
                var part = sink.CreatePart();
                return (Part: part, Buffer: CoincidenceBuffer.For(part), Q: new long[pair.PositionsB.Length], Qi: new int[pair.PositionsB.Length]);
            },
            (s, _, local) =>
            {
                var k = s < options.Slides ? s - options.Slides : s - options.Slides + 1;
                var n = Slide(pair, options, k, local.Q, local.Qi, local.Buffer);
                local.Buffer.Flush();
                var f = Interlocked.Add(ref found, n);
                progress?.Report(new BackgroundProgress(Interlocked.Increment(ref done), total, f));
                return local;
            },
            local =>
            {
                lock (sink)
                {
                    sink.Merge(local.Part);
                }
            });
    }

    private static long Slide(TimeSlidePair pair, TimeSlideOptions options, int k, long[] q, int[] qi, CoincidenceBuffer sink)
    {
        var span = pair.SpanNs;
        var w = options.WindowNs;
        var tol = options.ChirpMassRelativeTolerance ?? double.NaN;
        var pb = pair.PositionsB;
        var pa = pair.PositionsA;
        var n = pb.Length;
        var shift = RingOverlap.FloorMod(k * options.StepNs, span);

        // rotate: positions that pass the end of the ring come first
        var r = LowerBound(pb, span - shift);
        var m = 0;
        for (var j = r; j < n; j++, m++)
        {
            q[m] = pb[j] + shift - span;
            qi[m] = j;
        }

        for (var j = 0; j < r; j++, m++)
        {
            q[m] = pb[j] + shift;
            qi[m] = j;
        }

        if (n == 0)
        {
            return 0;
        }

        // merge against A over the images of q at -L, 0, +L (virtual index v in [-n, 2n))
        long found = 0;
        var lo = -n;
        for (var i = 0; i < pa.Length; i++)
        {
            var x = pa[i];
            while (lo < 2 * n && Value(q, n, span, lo) < x - w)
            {
                lo++;
            }

            for (var v = lo; v < 2 * n && Value(q, n, span, v) <= x + w; v++)
            {
                var jb = qi[((v % n) + n) % n];
                if (ChirpAgreement.Agrees(pair.ChirpMassA[i], pair.ChirpMassB[jb], tol))
                {
                    sink.Add(k, i, jb, Math.Sqrt(pair.SnrSquaredA[i] + pair.SnrSquaredB[jb]));
                    found++;
                }
            }
        }

        return found;
    }

    private static long Value(long[] q, int n, long span, int v) =>
        v < 0 ? q[v + n] - span : v >= n ? q[v - n] + span : q[v];

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
