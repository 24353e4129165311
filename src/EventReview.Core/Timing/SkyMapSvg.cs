using System.Globalization;
using System.Net;
using System.Text;
using EventReview.Core.Antenna;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Pictures;
using EventReview.Core.Time;

namespace EventReview.Core.Timing;

/// <summary>
/// An all-sky map of a timing check as a standalone SVG string: equirectangular projection with RA running from 360° at the left to
/// 0° at the right (east to the left, as on the sky seen from inside) and Dec from -90° at the bottom to +90° at the top; a 30°
/// graticule with labelled axes in degrees; each pair's ring as a curve; the sky solutions as markers; antenna-allowed cells shaded;
/// a one-line caption. RA/Dec are mean-of-date at the check's GMST (UT1 taken as UTC). No fonts, scripts or external references;
/// numbers in invariant culture.
/// </summary>
public static class SkyMapSvg
{
    private const double PlotWidth = 720;
    private const double PlotHeight = 360;
    private const double Left = 60;
    private const double Top = 20;
    private const int RingSamples = 361;

    /// <summary>Renders the map for a result of <see cref="TimingCheck.Run"/> over <paramref name="sites"/>, with optional antenna-allowed cells.</summary>
    public static string Render(IReadOnlyList<Site> sites, TimingCheckResult result, IReadOnlyList<SkyCell>? allowedCells = null)
    {
        ArgumentNullException.ThrowIfNull(sites);
        ArgumentNullException.ThrowIfNull(result);
        var byCode = sites.ToDictionary(s => s.Code, StringComparer.OrdinalIgnoreCase);
        var svg = new StringBuilder();
        var width = Left + PlotWidth + 20;
        var height = Top + PlotHeight + 106;
        svg.Append(F($"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{width}\" height=\"{height}\" viewBox=\"0 0 {width} {height}\" font-family=\"sans-serif\" font-size=\"12\">"));
        svg.Append(F($"<rect x=\"{Left}\" y=\"{Top}\" width=\"{PlotWidth}\" height=\"{PlotHeight}\" fill=\"{PicturePalette.Surface}\" stroke=\"{PicturePalette.Text}\"/>"));
        foreach (var cell in allowedCells ?? [])
        {
            var x = X(cell.RaDegrees + (cell.WidthDegrees / 2));
            var y = Y(cell.DecDegrees + (cell.HeightDegrees / 2));
            svg.Append(F($"<rect class=\"allowed\" x=\"{x:0.##}\" y=\"{y:0.##}\" width=\"{cell.WidthDegrees * PlotWidth / 360:0.##}\" height=\"{cell.HeightDegrees * PlotHeight / 180:0.##}\" fill=\"{PicturePalette.Warm}\" fill-opacity=\"0.22\"/>"));
        }

        Graticule(svg);
        var ringIndex = 0;
        var legend = new List<(string Colour, string Label)>();
        foreach (var pair in result.Pairs)
        {
            if (pair.RingAngleDegrees is null || !byCode.TryGetValue(pair.A, out var a) || !byCode.TryGetValue(pair.B, out var b))
            {
                continue;
            }

            var colour = PicturePalette.Series[ringIndex++ % PicturePalette.Series.Count];
            var axis = SiteGeometry.Position(a) - SiteGeometry.Position(b);
            var points = SkyRing.Directions(axis, pair.RingCosine, RingSamples).Append(SkyRing.Directions(axis, pair.RingCosine, RingSamples)[0])
                .Select(n => SkyFrame.ToEquatorial(n, result.GmstDegrees)).ToList();
            Curve(svg, points, colour, $"ring {pair.A}-{pair.B}");
            legend.Add((colour, F($"ring {pair.A}-{pair.B} ({pair.RingAngleDegrees:0.0}° about the baseline)")));
        }

        foreach (var (solution, i) in result.Sky.Select((s, i) => (s, i)))
        {
            var x = X(solution.RaDegrees);
            var y = Y(solution.DecDegrees);
            svg.Append(F($"<g class=\"solution\"><circle cx=\"{x:0.##}\" cy=\"{y:0.##}\" r=\"5\" fill=\"none\" stroke=\"{PicturePalette.Text}\" stroke-width=\"2\"/>"));
            svg.Append(F($"<text x=\"{x + 7:0.##}\" y=\"{y - 7:0.##}\">{i + 1}</text></g>"));
        }

        var legendX = (double)Left;
        foreach (var (colour, label) in legend)
        {
            svg.Append(F($"<line x1=\"{legendX:0.#}\" y1=\"{Top + PlotHeight + 42}\" x2=\"{legendX + 18:0.#}\" y2=\"{Top + PlotHeight + 42}\" stroke=\"{colour}\" stroke-width=\"2\"/>"));
            svg.Append(F($"<text x=\"{legendX + 22:0.#}\" y=\"{Top + PlotHeight + 46}\">{WebUtility.HtmlEncode(label)}</text>"));
            legendX += 40 + (label.Length * 5.6);
        }

        var offset = result.Sky.Count > 0 ? result.Sky.Max(x => x.IcrsOffsetDegrees) : 0;
        var caption = F($"All-sky map, RA/Dec mean-of-date, not ICRS{(offset > 0 ? F($" (up to {offset:0.00}° apart here)") : string.Empty)}; RA increases to the left.");
        var caption1 = F($"GMST {result.GmstDegrees:0.000}° (UT1 taken as UTC) at {result.Utc}.");
        var caption2 = F($"{ringIndex} ring(s); {result.Sky.Count} solution(s) circled, numbered best first") + (allowedCells is null ? "." : "; shaded: directions the antenna patterns allow.");
        svg.Append(F($"<text x=\"{Left}\" y=\"{Top + PlotHeight + 64}\">{WebUtility.HtmlEncode(caption)}</text>"));
        svg.Append(F($"<text x=\"{Left}\" y=\"{Top + PlotHeight + 78}\">{WebUtility.HtmlEncode(caption1)}</text>"));
        svg.Append(F($"<text x=\"{Left}\" y=\"{Top + PlotHeight + 92}\">{WebUtility.HtmlEncode(caption2)}</text>"));
        svg.Append("</svg>");
        return svg.ToString();
    }

    private static void Graticule(StringBuilder svg)
    {
        for (var ra = 0; ra <= 360; ra += 30)
        {
            var x = X(ra);
            svg.Append(F($"<line x1=\"{x:0.##}\" y1=\"{Top}\" x2=\"{x:0.##}\" y2=\"{Top + PlotHeight}\" stroke=\"{PicturePalette.RuleStrong}\" stroke-width=\"0.5\"/>"));
            svg.Append(F($"<text x=\"{x:0.##}\" y=\"{Top + PlotHeight + 14}\" text-anchor=\"middle\">{ra}</text>"));
        }

        for (var dec = -90; dec <= 90; dec += 30)
        {
            var y = Y(dec);
            svg.Append(F($"<line x1=\"{Left}\" y1=\"{y:0.##}\" x2=\"{Left + PlotWidth}\" y2=\"{y:0.##}\" stroke=\"{PicturePalette.RuleStrong}\" stroke-width=\"0.5\"/>"));
            svg.Append(F($"<text x=\"{Left - 6}\" y=\"{y + 4:0.##}\" text-anchor=\"end\">{dec}</text>"));
        }

        svg.Append(F($"<text x=\"{Left + (PlotWidth / 2)}\" y=\"{Top + PlotHeight + 30}\" text-anchor=\"middle\">right ascension (degrees)</text>"));
        svg.Append(F($"<text x=\"14\" y=\"{Top + (PlotHeight / 2)}\" text-anchor=\"middle\" transform=\"rotate(-90 14 {Top + (PlotHeight / 2)})\">declination (degrees)</text>"));
    }

    private static void Curve(StringBuilder svg, List<EquatorialDirection> points, string colour, string title)
    {
        svg.Append(F($"<g class=\"ring\" stroke=\"{colour}\" fill=\"none\" stroke-width=\"1.5\"><title>{WebUtility.HtmlEncode(title)}</title>"));
        var segment = new List<string>();
        for (var i = 0; i < points.Count; i++)
        {
            // Break the polyline where it wraps across RA 0/360.
            if (i > 0 && Math.Abs(points[i].RaDegrees - points[i - 1].RaDegrees) > 180)
            {
                Flush(svg, segment);
            }

            segment.Add(F($"{X(points[i].RaDegrees):0.##},{Y(points[i].DecDegrees):0.##}"));
        }

        Flush(svg, segment);
        svg.Append("</g>");
    }

    private static void Flush(StringBuilder svg, List<string> segment)
    {
        if (segment.Count > 1)
        {
            svg.Append("<polyline points=\"").Append(string.Join(' ', segment)).Append("\"/>");
        }

        segment.Clear();
    }

    private static double X(double raDegrees) => Left + ((360 - raDegrees) / 360 * PlotWidth);

    private static double Y(double decDegrees) => Top + ((90 - decDegrees) / 180 * PlotHeight);

    private static string F(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
