using System.Globalization;
using System.Text;
using EventReview.Core.Pictures;

namespace EventReview.Core.Environment;

/// <summary>
/// Draws the environment lookup as an SVG timeline: per site, one row per channel that fired and one row for active
/// data-quality segments; x axis in seconds relative to the site's arrival time; the lookup window shaded; markers at
/// trigger offsets with area growing with SNR and labelled with it; a one-line caption. The label column grows with the
/// longest row label (channel names in plain words are long) so a label never runs into the plot.
/// </summary>
public static class EnvironmentTimelineSvg
{
    private const double PlotWidth = 600;
    private const double MinLeft = 200;
    private const double Right = 20;
    private const double RowHeight = 26;

    /// <summary>Width of one character of the 11 px sans-serif labels, px; generous so that wide letters still fit.</summary>
    private const double LabelCharWidth = 6.6;

    /// <summary>Renders the report as a standalone SVG document (UTF-8 text, no external resources).</summary>
    /// <param name="report">The lookup result.</param>
    /// <param name="windowSeconds">Half window to shade, seconds (&gt; 0).</param>
    /// <param name="spanSeconds">Half width of the axis, seconds; null uses 1.5 x the largest window or hit offset.</param>
    public static string Render(EnvironmentReport report, double windowSeconds, double? spanSeconds = null)
    {
        ArgumentNullException.ThrowIfNull(report);
        if (!(windowSeconds > 0) || !double.IsFinite(windowSeconds))
        {
            throw new ArgumentOutOfRangeException(nameof(windowSeconds), windowSeconds, "Window must be finite and > 0 s.");
        }

        var span = spanSeconds ?? 1.5 * report.Hits.Select(h => Math.Max(h.WindowSeconds, Math.Abs(h.OffsetSeconds))).Append(windowSeconds).Max();
        var rows = new List<(string Label, Action<StringBuilder, double, Axis> Draw)>();
        foreach (var site in report.Sites)
        {
            rows.Add(($"{site.Site} ({site.Judgement.Word})", (_, _, _) => { }));
            foreach (var channel in report.Hits.Where(h => h.Site == site.Site).GroupBy(h => h.Channel))
            {
                var list = channel.ToList();
                rows.Add(($"  {channel.Key} [{list[0].Kind}]", (sb, y, axis) => DrawHits(sb, y, list, axis)));
            }

            var segs = report.Segments.Where(s => s.Site == site.Site).ToList();
            if (segs.Count > 0)
            {
                rows.Add(("  data-quality flags", (sb, y, axis) => DrawSegments(sb, y, segs, site.Gps, axis)));
            }
        }

        var left = Math.Max(MinLeft, Math.Ceiling(12 + (LabelCharWidth * rows.Select(r => r.Label.Length).DefaultIfEmpty(0).Max())));
        var axis = new Axis(left, left + PlotWidth + Right, span);
        var top = 20.0;
        var height = top + (rows.Count * RowHeight) + 60;
        var sb = new StringBuilder();
        sb.Append(F($"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{axis.Width}\" height=\"{height}\" viewBox=\"0 0 {axis.Width} {height}\" font-family=\"sans-serif\" font-size=\"11\">"));
        sb.Append(F($"<rect x=\"{axis.X(-windowSeconds)}\" y=\"{top}\" width=\"{axis.X(windowSeconds) - axis.X(-windowSeconds)}\" height=\"{rows.Count * RowHeight}\" fill=\"{PicturePalette.WarmTint}\"/>"));
        sb.Append(F($"<line x1=\"{axis.X(0)}\" y1=\"{top}\" x2=\"{axis.X(0)}\" y2=\"{top + (rows.Count * RowHeight)}\" stroke=\"{PicturePalette.TextSoft}\" stroke-dasharray=\"3,3\"/>"));
        for (var i = 0; i < rows.Count; i++)
        {
            var y = top + (i * RowHeight) + (RowHeight / 2);
            sb.Append(F($"<text x=\"4\" y=\"{y + 4}\" xml:space=\"preserve\">{Escape(rows[i].Label)}</text>"));
            sb.Append(F($"<line x1=\"{axis.Left}\" y1=\"{y}\" x2=\"{axis.Width - Right}\" y2=\"{y}\" stroke=\"{PicturePalette.Rule}\"/>"));
            rows[i].Draw(sb, y, axis);
        }

        var axisY = top + (rows.Count * RowHeight) + 4;
        sb.Append(F($"<line x1=\"{axis.Left}\" y1=\"{axisY}\" x2=\"{axis.Width - Right}\" y2=\"{axisY}\" stroke=\"{PicturePalette.Text}\"/>"));
        for (var k = -4; k <= 4; k++)
        {
            var t = span * k / 4;
            sb.Append(F($"<line x1=\"{axis.X(t)}\" y1=\"{axisY}\" x2=\"{axis.X(t)}\" y2=\"{axisY + 4}\" stroke=\"{PicturePalette.Text}\"/>"));
            sb.Append(F($"<text x=\"{axis.X(t)}\" y=\"{axisY + 16}\" text-anchor=\"middle\">{t:0.###}</text>"));
        }

        sb.Append(F($"<text x=\"{axis.Left}\" y=\"{axisY + 32}\">seconds relative to each site's arrival time</text>"));
        sb.Append(F($"<text x=\"4\" y=\"{height - 6}\">{Escape(Caption(report, windowSeconds))}</text>"));
        sb.Append("</svg>");
        return sb.ToString();
    }

    /// <summary>The one-line caption drawn under the timeline.</summary>
    public static string Caption(EnvironmentReport report, double windowSeconds) => F(
        $"Environment and veto lookup: {report.Hits.Count} trigger(s) and {report.Segments.Count} data-quality segment(s) within ±{windowSeconds} s (shaded); overall verdict {report.Judgement.Word}.");

    private static void DrawHits(StringBuilder sb, double y, List<EnvironmentHit> hits, Axis axis)
    {
        foreach (var h in hits)
        {
            var r = 3 + (2.5 * Math.Log10(1 + h.Snr));
            var colour = h.Safe == false ? PicturePalette.Grey : PicturePalette.Brick;
            sb.Append(F($"<circle cx=\"{axis.X(h.OffsetSeconds)}\" cy=\"{y}\" r=\"{r:0.##}\" fill=\"{colour}\" fill-opacity=\"0.8\"><title>{Escape(h.Channel)} offset {h.OffsetSeconds:0.####} s, SNR {h.Snr:0.#}</title></circle>"));
            sb.Append(F($"<text x=\"{axis.X(h.OffsetSeconds) + r + 2}\" y=\"{y - 4}\" font-size=\"9\">SNR {h.Snr:0.#}</text>"));
        }
    }

    private static void DrawSegments(StringBuilder sb, double y, List<ActiveSegment> segs, double arrivalGps, Axis axis)
    {
        foreach (var s in segs)
        {
            var a = axis.X(Math.Max(-axis.Span, s.StartGps - arrivalGps));
            var b = axis.X(Math.Min(axis.Span, s.EndGps - arrivalGps));
            sb.Append(F($"<rect x=\"{a}\" y=\"{y - 6}\" width=\"{Math.Max(1, b - a)}\" height=\"12\" fill=\"{PicturePalette.Slate}\" fill-opacity=\"0.6\"><title>{Escape(s.Flag)}</title></rect>"));
            sb.Append(F($"<text x=\"{a + 2}\" y=\"{y + 4}\" font-size=\"9\" fill=\"{PicturePalette.Surface}\">{Escape(s.Flag)}</text>"));
        }
    }

    /// <summary>The plot's horizontal layout: label column width, total width (px) and half span of the axis (s).</summary>
    private readonly record struct Axis(double Left, double Width, double Span)
    {
        public double X(double t) => Math.Round(Left + ((t + Span) / (2 * Span) * (Width - Left - Right)), 2);
    }

    private static string Escape(string s) => s.Replace("&", "&amp;").Replace("<", "&lt;").Replace(">", "&gt;").Replace("\"", "&quot;");

    private static string F(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
