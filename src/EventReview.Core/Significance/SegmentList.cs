namespace EventReview.Core.Significance;

/// <summary>Sorting, merging and measuring of analysed-time segments.</summary>
public static class SegmentList
{
    /// <summary>
    /// Sorts segments by start and merges those that overlap or touch (next start &lt;= current end),
    /// so that the result is sorted, disjoint and separated by gaps.
    /// </summary>
    /// <param name="segments">Segments in any order; each must have End &gt; Start.</param>
    /// <param name="mergedCount">Number of input segments that were absorbed into another (0 when all were disjoint).</param>
    /// <returns>The merged segments in time order.</returns>
    /// <exception cref="ArgumentException">When a segment has End &lt;= Start.</exception>
    public static IReadOnlyList<Segment> Merge(IEnumerable<Segment> segments, out int mergedCount)
    {
        ArgumentNullException.ThrowIfNull(segments);
        var sorted = segments.ToList();
        foreach (var s in sorted)
        {
            if (s.End <= s.Start)
            {
                throw new ArgumentException($"Segment [{s.Start}, {s.End}) must end after it starts.", nameof(segments));
            }
        }

        sorted.Sort((a, b) => a.Start.CompareTo(b.Start));
        var merged = new List<Segment>(sorted.Count);
        mergedCount = 0;
        foreach (var s in sorted)
        {
            if (merged.Count > 0 && s.Start <= merged[^1].End)
            {
                var last = merged[^1];
                merged[^1] = new Segment(last.Start, s.End > last.End ? s.End : last.End);
                mergedCount++;
            }
            else
            {
                merged.Add(s);
            }
        }

        return merged;
    }

    /// <summary>Total length of sorted, disjoint segments in nanoseconds.</summary>
    public static long TotalNanoseconds(IEnumerable<Segment> segments) => segments.Sum(s => s.DurationNanoseconds);

    /// <summary>
    /// Length in nanoseconds of the intersection of two sorted, disjoint segment lists (linear merge).
    /// </summary>
    public static long OverlapNanoseconds(IReadOnlyList<Segment> first, IReadOnlyList<Segment> second)
    {
        long total = 0;
        int i = 0, j = 0;
        while (i < first.Count && j < second.Count)
        {
            var lo = Math.Max(first[i].Start.Nanoseconds, second[j].Start.Nanoseconds);
            var hi = Math.Min(first[i].End.Nanoseconds, second[j].End.Nanoseconds);
            if (hi > lo)
            {
                total += hi - lo;
            }

            if (first[i].End.Nanoseconds < second[j].End.Nanoseconds)
            {
                i++;
            }
            else
            {
                j++;
            }
        }

        return total;
    }
}
