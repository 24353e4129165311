using System.Globalization;
using EventReview.Core.Environment;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// The environment and veto lookup as a timeline: one row per channel that fired (named "SITE/channel [kind]", the site
/// put in front when the channel name does not start with it) and one per
/// site for its active data-quality flags, top to bottom in site order; time in seconds from each site's arrival; the
/// lookup window ±w shaded; each trigger a dot whose size grows with its SNR (labelled), brick red when the channel is not
/// shown safe and grey when it is; each flag a bar over its active time. A site with nothing in its window gets a row that
/// says so, so no site silently drops out.
/// </summary>
public static class EnvironmentTimelineFigure
{
    /// <summary>The figure of <paramref name="report"/> with half window <paramref name="windowSeconds"/> (s, &gt; 0).</summary>
    /// <exception cref="ArgumentOutOfRangeException">When the window is not finite and positive.</exception>
    public static PlotFigure Build(EnvironmentReport report, double windowSeconds)
    {
        ArgumentNullException.ThrowIfNull(report);
        if (!(windowSeconds > 0) || !double.IsFinite(windowSeconds))
        {
            throw new ArgumentOutOfRangeException(nameof(windowSeconds), windowSeconds, "The window must be finite and > 0 s.");
        }

        var ci = CultureInfo.InvariantCulture;
        double span = 1.25 * report.Hits.Select(h => Math.Max(h.WindowSeconds, Math.Abs(h.OffsetSeconds))).Append(windowSeconds).Max();
        var rows = new List<(string Name, Action<double, List<PlotElement>> Draw)>();
        bool firstConcern = true, firstSafe = true, firstFlag = true;
        foreach (var site in report.Sites)
        {
            var channels = report.Hits.Where(h => h.Site == site.Site).GroupBy(h => h.Channel).ToList();
            var segments = report.Segments.Where(s => s.Site == site.Site).ToList();
            foreach (var channel in channels)
            {
                var hits = channel.ToList();
                string name = channel.Key.StartsWith(site.Site + "/", StringComparison.OrdinalIgnoreCase) ? channel.Key : $"{site.Site} {channel.Key}";
                rows.Add(($"{name} [{hits[0].Kind}]", (y, list) =>
                {
                    foreach (var h in hits)
                    {
                        bool safe = h.Safe == true;
                        string? label = safe ? (firstSafe ? "trigger, channel shown safe" : null) : (firstConcern ? "trigger, channel not shown safe" : null);
                        firstSafe &= !safe;
                        firstConcern &= safe;
                        list.Add(new PlotPoints([h.OffsetSeconds], [y]) { Colour = safe ? PlotPalette.Grey : PlotPalette.Alarm, Radius = 3 + (2.5 * Math.Log10(1 + h.Snr)), Label = label });
                        list.Add(new PlotText(h.OffsetSeconds + (span * 0.015), y + 0.18, string.Create(ci, $"SNR {h.Snr:0.#}")) { Colour = PlotPalette.Text });
                    }
                }));
            }

            if (segments.Count > 0)
            {
                rows.Add(($"{site.Site} data-quality flags", (y, list) =>
                {
                    foreach (var s in segments)
                    {
                        double a = Math.Max(-span, s.StartGps - site.Gps), b = Math.Min(span, s.EndGps - site.Gps);
                        list.Add(PlotBand.Rectangle(a, Math.Max(b, a + (span * 0.004)), y - 0.28, y + 0.28) with
                            { Colour = PlotPalette.Steel, Opacity = 0.55, Label = firstFlag ? "active data-quality flag" : null });
                        firstFlag = false;
                        list.Add(new PlotText(a + (span * 0.01), y + 0.33, s.Flag) { Colour = PlotPalette.Text });
                    }
                }));
            }

            if (channels.Count == 0 && segments.Count == 0)
            {
                rows.Add(($"{site.Site}: nothing in its window", (_, _) => { }));
            }
        }

        if (rows.Count == 0)
        {
            rows.Add(("no site looked up", (_, _) => { }));
        }

        var elements = new List<PlotElement>
        {
            PlotBand.Rectangle(-windowSeconds, windowSeconds, -0.5, rows.Count - 0.5) with
                { Colour = PlotPalette.Warm, Opacity = 0.12, Label = string.Create(ci, $"lookup window ±{windowSeconds:0.###} s") },
            new PlotLine([0, 0], [-0.5, rows.Count - 0.5]) { Colour = PlotPalette.Grey, Width = 1, Dashed = true },
        };
        for (int k = 0; k < rows.Count; k++)
        {
            rows[k].Draw(rows.Count - 1 - k, elements);
        }

        string caption = string.Create(ci,
            $"Environment lookup: {report.Hits.Count} trigger(s), {report.Segments.Count} data-quality segment(s) within the windows (±{windowSeconds:0.###} s shaded); {report.Judgement.Word}. Red dots inside the window need a look");
        return new PlotFigure(caption, new PlotAxis("time from each site's arrival (s)", -span, span),
            new PlotAxis("channel (one row each)", -0.5, rows.Count + 0.5 + (0.5 * LegendRows(elements))) { Categories = rows.Select(r => r.Name).Reverse().ToList() }, elements)
        { Height = Math.Max(260, (int)(150 + ((rows.Count + 1 + (0.5 * LegendRows(elements))) * 34))), LegendRight = true };
    }

    /// <summary>Rows the legend takes, so the axes leave room for it above the channels.</summary>
    internal static int LegendRows(IEnumerable<PlotElement> elements) => elements.Count(e => !string.IsNullOrEmpty(e.Label) && e is not PlotText);
}
