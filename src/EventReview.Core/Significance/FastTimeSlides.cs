using System.Collections.Concurrent;

namespace EventReview.Core.Significance;

/// <summary>
/// Finds every background coincidence of all slides k = ±1..±K in one pass, with work proportional to
/// triggers x log(triggers) + coincidences found (not slides x triggers).
/// </summary>
/// <remarks>
/// The method (ours; the time-slide background itself follows Was et al. 2010, CQG 27 015005):
/// <list type="number">
/// <item>Unroll the ring: with R = K step + W &lt; L / 2 (checked), a site-B trigger at p_B can only meet an
/// A trigger through one of its images y = p_B - L, p_B, p_B + L, and only images in [-R, L + R] matter.
/// A and B then meet at slide k exactly when |x - y - k step| &lt;= W on the line (x = p_A).</item>
/// <item>Write x = s_x step + φ_x and y = s_y step + φ_y with slots s and phases φ in [0, step). Because
/// step &gt; 2W, the only possible k is s_x - s_y when |φ_x - φ_y| &lt;= W, s_x - s_y + 1 when
/// φ_x - φ_y &gt;= step - W, and s_x - s_y - 1 when φ_y - φ_x &gt;= step - W; these three cases are disjoint
/// and exhaustive, and each is decided exactly in integer ns.</item>
/// <item>Group both sites into blocks of consecutive slots and sort each block by phase. For each block of A,
/// only the blocks of B whose slots lie within K + 1 of it can hold partners; each such pair of blocks is
/// swept once with three monotone pointers (the three phase windows above), and each candidate is kept
/// when 1 &lt;= |k| &lt;= K and it passes the optional chirp-mass cut.</item>
/// </list>
/// The result is the same set of (k, A trigger, B trigger) as <see cref="NaiveTimeSlides"/>.
/// </remarks>
public static class FastTimeSlides
{
    /// <summary>Sends every background coincidence of the 2K slides to the sink (in no particular order).</summary>
    /// <param name="pair">The two sites; B slides.</param>
    /// <param name="options">Window, step and K (validated against the ring span).</param>
    /// <param name="sink">Receives the coincidences; parts are created per worker thread and merged into it.</param>
    /// <param name="progress">Optional; reported after each chunk of site-A triggers.</param>
    /// <param name="cancellationToken">Checked between chunks.</param>
    /// <exception cref="OperationCanceledException">When cancelled.</exception>
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
        var step = options.StepNs;
        var k = options.Slides;
        var blockSlots = Math.Max(1L, k / 8);
        var a = PhaseBlocks.Build(pair.PositionsA, Identity(pair.PositionsA.Length), pair.SnrSquaredA, pair.ChirpMassA, step, blockSlots);
        var (yB, iB) = Unroll(pair.PositionsB, pair.SpanNs, (k * step) + options.WindowNs);
        var b = PhaseBlocks.Build(yB, iB, pair.SnrSquaredB, pair.ChirpMassB, step, blockSlots);

        var sweep = new Sweep(options, step, k, blockSlots, options.ChirpMassRelativeTolerance ?? double.NaN);
        var blocks = a.BlockIds.Length;
        var totalA = Math.Max(1, pair.PositionsA.Length);
        long found = 0;
        long doneA = 0;
        var chunk = Math.Max(1, blocks / 64);
        Parallel.ForEach(
            Partitioner.Create(0, blocks, chunk),
            new ParallelOptions { CancellationToken = cancellationToken },
            () =>
            {
                var part = sink.CreatePart();
                return (Part: part, Buffer: CoincidenceBuffer.For(part));
            },
            (range, _, local) =>
            {
                long n = 0;
                for (var blk = range.Item1; blk < range.Item2; blk++)
                {
                    n += sweep.Block(a, blk, b, local.Buffer);
                }

                local.Buffer.Flush();
                var triggers = a.BlockStarts[range.Item2] - a.BlockStarts[range.Item1];
                var f = Interlocked.Add(ref found, n);
                var d = Interlocked.Add(ref doneA, triggers);
                progress?.Report(new BackgroundProgress((int)(2L * k * d / totalA), 2 * k, f));
                return local;
            },
            local =>
            {
                lock (sink)
                {
                    sink.Merge(local.Part);
                }
            });
        progress?.Report(new BackgroundProgress(2 * k, 2 * k, found));
    }

    private static int[] Identity(int n)
    {
        var idx = new int[n];
        for (var i = 0; i < n; i++)
        {
            idx[i] = i;
        }

        return idx;
    }

    /// <summary>Images p - L (for p &gt;= L - R), p, and p + L (for p &lt;= R) in ascending order, with trigger indices.</summary>
    private static (long[] Y, int[] Index) Unroll(long[] p, long spanNs, long reachNs)
    {
        var y = new List<long>(p.Length + 64);
        var idx = new List<int>(p.Length + 64);
        for (var i = 0; i < p.Length; i++)
        {
            if (p[i] >= spanNs - reachNs)
            {
                y.Add(p[i] - spanNs);
                idx.Add(i);
            }
        }

        for (var i = 0; i < p.Length; i++)
        {
            y.Add(p[i]);
            idx.Add(i);
        }

        for (var i = 0; i < p.Length && p[i] <= reachNs; i++)
        {
            y.Add(p[i] + spanNs);
            idx.Add(i);
        }

        return (y.ToArray(), idx.ToArray());
    }

    /// <summary>The three-pointer sweep of one A block against the B blocks that can hold its partners.</summary>
    private sealed class Sweep(TimeSlideOptions options, long step, int slides, long blockSlots, double chirpTolerance)
    {
        private readonly long _w = options.WindowNs;

        public long Block(PhaseBlocks a, int blk, PhaseBlocks b, CoincidenceBuffer sink)
        {
            var id = a.BlockIds[blk];
            var lowSlot = (id * blockSlots) - slides - 1;
            var highSlot = ((id + 1) * blockSlots) + slides;
            var highId = RingOverlap.FloorDiv(highSlot, blockSlots);
            long found = 0;
            for (var bb = b.FirstBlockAtOrAfter(RingOverlap.FloorDiv(lowSlot, blockSlots)); bb < b.BlockIds.Length && b.BlockIds[bb] <= highId; bb++)
            {
                found += Pair(a, a.BlockStarts[blk], a.BlockStarts[blk + 1], b, b.BlockStarts[bb], b.BlockStarts[bb + 1], sink);
            }

            return found;
        }

        private long Pair(PhaseBlocks a, int aStart, int aEnd, PhaseBlocks b, int bStart, int bEnd, CoincidenceBuffer sink)
        {
            var w = _w;
            var wrap = step - w;
            var bPhase = b.Phase.AsSpan(0, bEnd);
            var bSlot = b.Slot.AsSpan(0, bEnd);
            var aPhase = a.Phase;
            var aSlot = a.Slot;
            int lo0 = bStart, hi0 = bStart, lo1 = bStart, hi2 = bStart;
            long found = 0;
            for (var i = aStart; i < aEnd; i++)
            {
                var phi = aPhase[i];
                var sx = aSlot[i];
                while (lo0 < bPhase.Length && bPhase[lo0] < phi - w)
                {
                    lo0++;
                }

                if (hi0 < lo0)
                {
                    hi0 = lo0;
                }

                while (hi0 < bPhase.Length && bPhase[hi0] <= phi + w)
                {
                    hi0++;
                }

                // |φx - φy| <= W: k = sx - sy
                for (var j = lo0; j < hi0; j++)
                {
                    var k = sx - bSlot[j];
                    if (k != 0 && (ulong)(k + slides) <= (ulong)(2 * slides))
                    {
                        found += Emit(a, i, b, j, k, sink);
                    }
                }

                if (phi < w)
                {
                    // φy - φx >= step - W: k = sx - sy - 1
                    while (lo1 < bPhase.Length && bPhase[lo1] < phi + wrap)
                    {
                        lo1++;
                    }

                    for (var j = lo1; j < bPhase.Length; j++)
                    {
                        var k = sx - bSlot[j] - 1;
                        if (k != 0 && (ulong)(k + slides) <= (ulong)(2 * slides))
                        {
                            found += Emit(a, i, b, j, k, sink);
                        }
                    }
                }
                else if (phi >= wrap)
                {
                    // φx - φy >= step - W: k = sx - sy + 1
                    while (hi2 < bPhase.Length && bPhase[hi2] <= phi - wrap)
                    {
                        hi2++;
                    }

                    for (var j = bStart; j < hi2; j++)
                    {
                        var k = sx - bSlot[j] + 1;
                        if (k != 0 && (ulong)(k + slides) <= (ulong)(2 * slides))
                        {
                            found += Emit(a, i, b, j, k, sink);
                        }
                    }
                }
            }

            return found;
        }

        private int Emit(PhaseBlocks a, int i, PhaseBlocks b, int j, long k, CoincidenceBuffer sink)
        {
            if (!double.IsNaN(chirpTolerance) && !ChirpAgreement.Agrees(a.ChirpMass[i], b.ChirpMass[j], chirpTolerance))
            {
                return 0;
            }

            sink.Add((int)k, a.Index[i], b.Index[j], Math.Sqrt(a.SnrSquared[i] + b.SnrSquared[j]));
            return 1;
        }
    }
}
