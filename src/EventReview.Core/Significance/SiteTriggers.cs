namespace EventReview.Core.Significance;

/// <summary>
/// One site's input to a time-slide analysis: its analysed time and the triggers that lie inside it.
/// Build with <see cref="Create"/>, which sorts, merges and filters.
/// </summary>
public sealed class SiteTriggers
{
    private SiteTriggers(string code, Trigger[] triggers, IReadOnlyList<Segment> segments, int dropped, int merged)
    {
        Code = code;
        Triggers = triggers;
        Segments = segments;
        DroppedOutsideSegments = dropped;
        MergedSegments = merged;
    }

    /// <summary>Site code (e.g. "KX").</summary>
    public string Code { get; }

    /// <summary>Triggers inside the segments, sorted by time (stable for equal times).</summary>
    public IReadOnlyList<Trigger> Triggers { get; }

    /// <summary>Sorted, disjoint, half-open analysed-time segments.</summary>
    public IReadOnlyList<Segment> Segments { get; }

    /// <summary>Triggers dropped because they were outside every segment (a time equal to a segment's end is outside).</summary>
    public int DroppedOutsideSegments { get; }

    /// <summary>Segments merged into a neighbour because they overlapped or touched it.</summary>
    public int MergedSegments { get; }

    /// <summary>
    /// Sorts the triggers by time, merges the segments and drops triggers outside them.
    /// </summary>
    /// <param name="code">Site code; not empty.</param>
    /// <param name="triggers">Triggers in any order.</param>
    /// <param name="segments">Segments in any order (merged here; the count of merges is kept).</param>
    /// <exception cref="ArgumentException">When the code is empty or there are no segments.</exception>
    public static SiteTriggers Create(string code, IEnumerable<Trigger> triggers, IEnumerable<Segment> segments)
    {
        if (string.IsNullOrWhiteSpace(code))
        {
            throw new ArgumentException("A site code is required.", nameof(code));
        }

        ArgumentNullException.ThrowIfNull(triggers);
        var merged = SegmentList.Merge(segments, out var mergedCount);
        if (merged.Count == 0)
        {
            throw new ArgumentException($"Site {code} has no analysed-time segments.", nameof(segments));
        }

        var sorted = triggers.ToArray();
        var keys = sorted.Select(t => t.Time.Nanoseconds).ToArray();
        var order = Enumerable.Range(0, sorted.Length).ToArray();
        Array.Sort(keys, order);
        for (int run = 0, end; run < keys.Length; run = end)
        {
            // introsort is unstable: put equal times back in file order
            for (end = run + 1; end < keys.Length && keys[end] == keys[run]; end++)
            {
            }

            if (end - run > 1)
            {
                Array.Sort(order, run, end - run);
            }
        }

        var kept = new List<Trigger>(sorted.Length);
        var seg = 0;
        foreach (var i in order)
        {
            var t = sorted[i].Time;
            while (seg < merged.Count && merged[seg].End <= t)
            {
                seg++;
            }

            if (seg < merged.Count && merged[seg].Contains(t))
            {
                kept.Add(sorted[i]);
            }
        }

        return new SiteTriggers(code.Trim(), kept.ToArray(), merged, sorted.Length - kept.Count, mergedCount);
    }
}
