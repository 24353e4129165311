namespace EventReview.Core.Significance;

/// <summary>Builds the cumulative background curve from an accumulator.</summary>
internal static class BackgroundCurve
{
    /// <summary>
    /// Exact counts at the loudest kept coincidences (where every coincidence that loud was kept) and at
    /// every non-empty histogram bin's lower edge below them; decimated to about <paramref name="maxPoints"/>
    /// points evenly spread in log(count); ordered by increasing statistic.
    /// </summary>
    public static List<BackgroundCurvePoint> Build(BackgroundAccumulator acc, IReadOnlyList<double> loudestStats, int keep, double backgroundSeconds, int maxPoints = 500)
    {
        var points = new List<(double Stat, long Count)>();
        var allKept = acc.Count <= keep;
        var floor = loudestStats.Count == 0 ? double.PositiveInfinity : loudestStats[^1];
        for (var r = 0; r < loudestStats.Count; r++)
        {
            var s = loudestStats[r];
            var lastOfTie = r + 1 == loudestStats.Count || loudestStats[r + 1] < s;
            if (lastOfTie && (allKept || s > floor))
            {
                points.Add((s, r + 1));
            }
        }

        var lowestExact = points.Count > 0 ? points[^1].Stat : double.PositiveInfinity;
        long cumulative = 0;
        var hist = acc.Histogram;
        for (var i = hist.Count - 1; i >= 0; i--)
        {
            cumulative += hist[i];
            var edge = i * acc.BinWidth;
            if (hist[i] > 0 && edge < lowestExact)
            {
                points.Add((edge, cumulative));
            }
        }

        // points are by decreasing statistic, increasing count; thin them evenly in log(count)
        var kept = new List<(double Stat, long Count)>();
        if (points.Count > 0)
        {
            var step = Math.Log(points[^1].Count) / Math.Max(1, maxPoints - 2);
            kept.Add(points[0]);
            for (var i = 1; i < points.Count - 1; i++)
            {
                if (Math.Log(points[i].Count) - Math.Log(kept[^1].Count) >= step)
                {
                    kept.Add(points[i]);
                }
            }

            if (points.Count > 1)
            {
                kept.Add(points[^1]);
            }
        }

        kept.Reverse();
        return [.. kept.Select(p => new BackgroundCurvePoint(p.Stat, p.Count, p.Count / backgroundSeconds))];
    }
}
