using System.Globalization;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// Review progress over time, from the recorded sign-offs: items fully signed (at least their required number of sign-offs
/// current at that moment: given, and not yet stale) and sign-offs given so far, as steps from the case's opening to its
/// last change; the number of items as the goal line. Time from the opening in seconds, minutes, hours or days, the
/// largest unit that the review spans at least twice. The same inputs (the stored sign-offs and the case's two times) give the same picture in the app
/// and in the dossier.
/// </summary>
public static class ReviewProgressFigure
{
    /// <summary>Items fully signed at <paramref name="ticks"/> (UTC, 100 ns).</summary>
    public static int SignedAt(IReadOnlyList<ReviewProgressItem> items, long ticks)
    {
        ArgumentNullException.ThrowIfNull(items);
        return items.Count(i => i.RequiredSignOffs > 0
            && i.SignOffs.Count(s => s.SignedAtUtcTicks <= ticks && (s.StaleSinceUtcTicks is not { } stale || stale > ticks)) >= i.RequiredSignOffs);
    }

    /// <summary>The chart of <paramref name="items"/> from <paramref name="openedUtcTicks"/> to <paramref name="untilUtcTicks"/>.</summary>
    public static PlotFigure Build(IReadOnlyList<ReviewProgressItem> items, long openedUtcTicks, long untilUtcTicks)
    {
        ArgumentNullException.ThrowIfNull(items);
        var ci = CultureInfo.InvariantCulture;
        long end = Math.Max(untilUtcTicks, openedUtcTicks + TimeSpan.TicksPerMinute);
        var events = items.SelectMany(i => i.SignOffs).SelectMany(s => s.StaleSinceUtcTicks is { } st ? new[] { s.SignedAtUtcTicks, st } : [s.SignedAtUtcTicks])
            .Where(t => t >= openedUtcTicks && t <= end).Append(openedUtcTicks).Append(end).Distinct().Order().ToList();
        long span = end - openedUtcTicks;
        var (unit, unitName) = span < 2 * TimeSpan.TicksPerMinute ? (TimeSpan.TicksPerSecond, "seconds")
            : span < 2 * TimeSpan.TicksPerHour ? (TimeSpan.TicksPerMinute, "minutes")
            : span < 2 * TimeSpan.TicksPerDay ? (TimeSpan.TicksPerHour, "hours") : (TimeSpan.TicksPerDay, "days");
        double X(long t) => (t - openedUtcTicks) / (double)unit;
        var xs = new List<double>();
        var signed = new List<double>();
        var given = new List<double>();
        for (int k = 0; k < events.Count; k++)
        {
            long t = events[k];
            if (k > 0)
            {
                xs.Add(X(t));
                signed.Add(signed[^1]);
                given.Add(given[^1]);
            }

            xs.Add(X(t));
            signed.Add(SignedAt(items, t));
            given.Add(items.SelectMany(i => i.SignOffs).Count(s => s.SignedAtUtcTicks <= t));
        }

        int total = items.Count, needing = items.Count(i => i.RequiredSignOffs > 0);
        double top = (Math.Max(total, given.DefaultIfEmpty(0).Max()) * 1.45) + 2; // room above the goal line for the legend
        var elements = new List<PlotElement>
        {
            new PlotLine([0, X(end)], [needing, needing]) { Colour = PlotPalette.Grey, Dashed = true, Width = 1.2, Label = string.Create(ci, $"items needing sign-off ({needing})") },
            new PlotLine(xs, given) { Colour = PlotPalette.Warm, Dashed = true, Width = 1.6, Label = "sign-offs given (stale ones included)" },
            new PlotLine(xs, signed) { Colour = PlotPalette.Ink, Width = 2.4, Label = "items fully signed (current sign-offs)" },
        };
        int now = signed.Count == 0 ? 0 : (int)signed[^1];
        string caption = string.Create(ci,
            $"Review progress: {now} of {needing} items fully signed at the last change, {(int)given.DefaultIfEmpty(0).Last()} sign-offs given; a drop means sign-offs went stale when evidence changed");
        return new PlotFigure(caption, new PlotAxis($"time since the case was opened ({unitName})", 0, X(end)),
            new PlotAxis("items or sign-offs (count)", 0, top), elements) { Width = 620, Height = 320 };
    }
}
