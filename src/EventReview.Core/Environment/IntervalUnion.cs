namespace EventReview.Core.Environment;

/// <summary>Length of the union of closed intervals on a line (seconds), for exposure and deadtime.</summary>
internal static class IntervalUnion
{
    /// <summary>Total length covered by the intervals, each counted once where they overlap.</summary>
    public static double Length(IEnumerable<(double From, double To)> intervals)
    {
        var total = 0.0;
        double? start = null;
        var end = double.NegativeInfinity;
        foreach (var (from, to) in intervals.Where(i => i.To > i.From).OrderBy(i => i.From))
        {
            if (start is null || from > end)
            {
                if (start is { } s)
                {
                    total += end - s;
                }

                start = from;
                end = to;
            }
            else
            {
                end = Math.Max(end, to);
            }
        }

        if (start is { } last)
        {
            total += end - last;
        }

        return total;
    }
}
