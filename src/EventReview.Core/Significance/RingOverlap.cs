namespace EventReview.Core.Significance;

/// <summary>Exact interval arithmetic on the ring [0, L), on flat arrays [start0, end0, start1, end1, ...] in ns.</summary>
internal static class RingOverlap
{
    /// <summary>Moves sorted disjoint segments by shift modulo L, splitting one that crosses the seam; result sorted.</summary>
    public static long[] Shift(long[] segments, long shiftNs, long spanNs)
    {
        var s = FloorMod(shiftNs, spanNs);
        var pieces = new List<(long Start, long End)>(segments.Length / 2 + 1);
        for (var i = 0; i < segments.Length; i += 2)
        {
            var start = segments[i] + s;
            var end = segments[i + 1] + s;
            if (start >= spanNs)
            {
                pieces.Add((start - spanNs, end - spanNs));
            }
            else if (end > spanNs)
            {
                pieces.Add((start, spanNs));
                pieces.Add((0, end - spanNs));
            }
            else
            {
                pieces.Add((start, end));
            }
        }

        pieces.Sort();
        var flat = new long[pieces.Count * 2];
        for (var i = 0; i < pieces.Count; i++)
        {
            flat[2 * i] = pieces[i].Start;
            flat[(2 * i) + 1] = pieces[i].End;
        }

        return flat;
    }

    /// <summary>Length of the intersection of two sorted lists of disjoint segments (linear merge).</summary>
    public static long Nanoseconds(long[] a, long[] b)
    {
        long total = 0;
        int i = 0, j = 0;
        while (i < a.Length && j < b.Length)
        {
            var lo = Math.Max(a[i], b[j]);
            var hi = Math.Min(a[i + 1], b[j + 1]);
            if (hi > lo)
            {
                total += hi - lo;
            }

            if (a[i + 1] < b[j + 1])
            {
                i += 2;
            }
            else
            {
                j += 2;
            }
        }

        return total;
    }

    /// <summary>The intersection of two sorted lists of disjoint segments, as a sorted list.</summary>
    public static long[] Intersect(long[] a, long[] b)
    {
        var list = new List<long>();
        int i = 0, j = 0;
        while (i < a.Length && j < b.Length)
        {
            var lo = Math.Max(a[i], b[j]);
            var hi = Math.Min(a[i + 1], b[j + 1]);
            if (hi > lo)
            {
                list.Add(lo);
                list.Add(hi);
            }

            if (a[i + 1] < b[j + 1])
            {
                i += 2;
            }
            else
            {
                j += 2;
            }
        }

        return [.. list];
    }

    /// <summary>Flat ring coordinates of segments relative to an origin.</summary>
    public static long[] Flatten(IReadOnlyList<Segment> segments, long origin)
    {
        var flat = new long[segments.Count * 2];
        for (var i = 0; i < segments.Count; i++)
        {
            flat[2 * i] = segments[i].Start.Nanoseconds - origin;
            flat[(2 * i) + 1] = segments[i].End.Nanoseconds - origin;
        }

        return flat;
    }

    /// <summary>x mod m in [0, m) for m &gt; 0.</summary>
    public static long FloorMod(long x, long m)
    {
        var r = x % m;
        return r < 0 ? r + m : r;
    }

    /// <summary>floor(x / m) for m &gt; 0.</summary>
    public static long FloorDiv(long x, long m)
    {
        var q = x / m;
        return (x % m != 0 && x < 0) ? q - 1 : q;
    }
}
