using System.Globalization;
using System.Text;
using EventReview.Core.Pictures;

namespace EventReview.Core.Environment;

/// <summary>
/// Draws the environment lookup as an SVG timeline: per site, one row per channel that fired and one row for active
/// data-quality segments; x axis in seconds relative to the site's arrival time; the lookup window shaded; markers at
/// trigger offsets with area growing with SNR and labelled with it; a one-line caption.
/// </summary>
public static class EnvironmentTimelineSvg
{
    private const double Width = 820;
    private const double Left = 200;
    private const double Right = 20;
    private const double RowHeight = 26;

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
        var rows = new List<(string Label, Action<StringBuilder, double> Draw)>();
        foreach (var site in report.Sites)
        {
            rows.Add(($"{site.Site} ({site.Judgement.Word})", (_, _) => { }));
            foreach (var channel in report.Hits.Where(h => h.Site == site.Site).GroupBy(h => h.Channel))
            {
                var list = channel.ToList();
                rows.Add(($"  {channel.Key} [{list[0].Kind}]", (sb, y) => DrawHits(sb, y, list, span)));
            }

            var segs = report.Segments.Where(s => s.Site == site.Site).ToList();
            if (segs.Count > 0)
            {
                rows.Add(("  data-quality flags", (sb, y) => DrawSegments(sb, y, segs, site.Gps, span)));
            }
        }

        var top = 20.0;
        var height = top + (rows.Count * RowHeight) + 60;
        var sb = new StringBuilder();
        sb.Append(F($"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{Width}\" height=\"{height}\" viewBox=\"0 0 {Width} {height}\" font-family=\"sans-serif\" font-size=\"11\">"));
        sb.Append(F($"<rect x=\"{X(-windowSeconds, span)}\" y=\"{top}\" width=\"{X(windowSeconds, span) - X(-windowSeconds, span)}\" height=\"{rows.Count * RowHeight}\" fill=\"{PicturePalette.WarmTint}\"/>"));
        sb.Append(F($"<line x1=\"{X(0, span)}\" y1=\"{top}\" x2=\"{X(0, span)}\" y2=\"{top + (rows.Count * RowHeight)}\" stroke=\"{PicturePalette.TextSoft}\" stroke-dasharray=\"3,3\"/>"));
        for (var i = 0; i < rows.Count; i++)
        {
            var y = top + (i * RowHeight) + (RowHeight / 2);
            sb.Append(F($"<text x=\"4\" y=\"{y + 4}\" xml:space=\"preserve\">{Escape(rows[i].Label)}</text>"));
            sb.Append(F($"<line x1=\"{Left}\" y1=\"{y}\" x2=\"{Width - Right}\" y2=\"{y}\" stroke=\"{PicturePalette.Rule}\"/>"));
            rows[i].Draw(sb, y);
        }

        var axisY = top + (rows.Count * RowHeight) + 4;
        sb.Append(F($"<line x1=\"{Left}\" y1=\"{axisY}\" x2=\"{Width - Right}\" y2=\"{axisY}\" stroke=\"{PicturePalette.Text}\"/>"));
        for (var k = -4; k <= 4; k++)
        {
            var t = span * k / 4;
            sb.Append(F($"<line x1=\"{X(t, span)}\" y1=\"{axisY}\" x2=\"{X(t, span)}\" y2=\"{axisY + 4}\" stroke=\"{PicturePalette.Text}\"/>"));
            sb.Append(F($"<text x=\"{X(t, span)}\" y=\"{axisY + 16}\" text-anchor=\"middle\">{t:0.###}</text>"));
        }

        sb.Append(F($"<text x=\"{Left}\" y=\"{axisY + 32}\">seconds relative to each site's arrival time</text>"));
        sb.Append(F($"<text x=\"4\" y=\"{height - 6}\">{Escape(Caption(report, windowSeconds))}</text>"));
        sb.Append("</svg>");
        return sb.ToString();
    }

    /// <summary>The one-line caption drawn under the timeline.</summary>
    public static string Caption(EnvironmentReport report, double windowSeconds) => F(
        $"Environment and veto lookup: {report.Hits.Count} trigger(s) and {report.Segments.Count} data-quality segment(s) within ±{windowSeconds} s (shaded); overall verdict {report.Judgement.Word}.");

    private static void DrawHits(StringBuilder sb, double y, List<EnvironmentHit> hits, double span)
    {
        foreach (var h in hits)
        {
            var r = 3 + (2.5 * Math.Log10(1 + h.Snr));
            var colour = h.Safe == false ? PicturePalette.Grey : PicturePalette.Brick;
            sb.Append(F($"<circle cx=\"{X(h.OffsetSeconds, span)}\" cy=\"{y}\" r=\"{r:0.##}\" fill=\"{colour}\" fill-opacity=\"0.8\"><title>{Escape(h.Channel)} offset {h.OffsetSeconds:0.####} s, SNR {h.Snr:0.#}</title></circle>"));
            sb.Append(F($"<text x=\"{X(h.OffsetSeconds, span) + r + 2}\" y=\"{y - 4}\" font-size=\"9\">SNR {h.Snr:0.#}</text>"));
        }
    }

    private static void DrawSegments(StringBuilder sb, double y, List<ActiveSegment> segs, double arrivalGps, double span)
    {
        foreach (var s in segs)
        {
            var a = X(Math.Max(-span, s.StartGps - arrivalGps), span);
            var b = X(Math.Min(span, s.EndGps - arrivalGps), span);
            sb.Append(F($"<rect x=\"{a}\" y=\"{y - 6}\" width=\"{Math.Max(1, b - a)}\" height=\"12\" fill=\"{PicturePalette.Slate}\" fill-opacity=\"0.6\"><title>{Escape(s.Flag)}</title></rect>"));
            sb.Append(F($"<text x=\"{a + 2}\" y=\"{y + 4}\" font-size=\"9\" fill=\"{PicturePalette.Surface}\">{Escape(s.Flag)}</text>"));
        }
    }

    private static double X(double t, double span) => Math.Round(Left + ((t + span) / (2 * span) * (Width - Left - Right)), 2);

    private static string Escape(string s) => s.Replace("&", "&amp;").Replace("<", "&lt;").Replace(">", "&gt;").Replace("\"", "&quot;");

    private static string F(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
