using System.Globalization;
using System.Net;
using System.Text;
using EventReview.Core.Geodesy;
using EventReview.Core.Pictures;

namespace EventReview.Core.Network;

/// <summary>
/// A simple world plot of the sites (equirectangular: longitude -180..180 left to right, latitude -90..90 bottom to top),
/// with a graticule every 30°, each site as a dot with its code, and each baseline as a straight line labelled with its
/// light-travel time in ms. No map tiles or coastlines: positions only.
/// </summary>
public static class NetworkMapSvg
{
    private const double Width = 720, Height = 360, Left = 48, Top = 16, PlotW = 640, PlotH = 320;

    /// <summary>Renders the plot as a standalone SVG document (invariant-culture numbers, no external resources).</summary>
    public static string Render(IReadOnlyList<Site> sites)
    {
        var sb = new StringBuilder();
        sb.Append(CultureInfo.InvariantCulture, $"<svg xmlns=\"http://www.w3.org/2000/svg\" viewBox=\"0 0 {Width} {Height + 40}\" role=\"img\" aria-label=\"Sites of the network on a longitude-latitude plot\" font-family=\"DejaVu Sans, sans-serif\" font-size=\"11\">");
        sb.Append(CultureInfo.InvariantCulture, $"<rect x=\"{Left}\" y=\"{Top}\" width=\"{PlotW}\" height=\"{PlotH}\" fill=\"{PicturePalette.Paper}\" stroke=\"{PicturePalette.Grey}\"/>");
        for (var lon = -180; lon <= 180; lon += 30)
        {
            var x = X(lon);
            sb.Append(CultureInfo.InvariantCulture, $"<line x1=\"{x:F1}\" y1=\"{Top}\" x2=\"{x:F1}\" y2=\"{Top + PlotH}\" stroke=\"{PicturePalette.RuleStrong}\"/>");
            sb.Append(CultureInfo.InvariantCulture, $"<text x=\"{x:F1}\" y=\"{Top + PlotH + 14}\" text-anchor=\"middle\" fill=\"{PicturePalette.TextSoft}\">{lon}°</text>");
        }

        for (var lat = -90; lat <= 90; lat += 30)
        {
            var y = Y(lat);
            sb.Append(CultureInfo.InvariantCulture, $"<line x1=\"{Left}\" y1=\"{y:F1}\" x2=\"{Left + PlotW}\" y2=\"{y:F1}\" stroke=\"{PicturePalette.RuleStrong}\"/>");
            sb.Append(CultureInfo.InvariantCulture, $"<text x=\"{Left - 6}\" y=\"{y + 4:F1}\" text-anchor=\"end\" fill=\"{PicturePalette.TextSoft}\">{lat}°</text>");
        }

        for (var i = 0; i < sites.Count; i++)
        {
            for (var j = i + 1; j < sites.Count; j++)
            {
                var a = sites[i];
                var b = sites[j];
                var baseline = Baseline.Between(a, b);
                double x1 = X(a.LongitudeDegrees), y1 = Y(a.LatitudeDegrees), x2 = X(b.LongitudeDegrees), y2 = Y(b.LatitudeDegrees);
                sb.Append(CultureInfo.InvariantCulture, $"<line x1=\"{x1:F1}\" y1=\"{y1:F1}\" x2=\"{x2:F1}\" y2=\"{y2:F1}\" stroke=\"{PicturePalette.Ink}\" stroke-dasharray=\"4 3\"/>");
                sb.Append(CultureInfo.InvariantCulture, $"<text x=\"{(x1 + x2) / 2:F1}\" y=\"{((y1 + y2) / 2) - 4:F1}\" text-anchor=\"middle\" fill=\"{PicturePalette.Ink}\">{baseline.LightTravelSeconds * 1000:F2} ms</text>");
            }
        }

        foreach (var s in sites)
        {
            double x = X(s.LongitudeDegrees), y = Y(s.LatitudeDegrees);
            sb.Append(CultureInfo.InvariantCulture, $"<circle cx=\"{x:F1}\" cy=\"{y:F1}\" r=\"5\" fill=\"{PicturePalette.Warm}\" stroke=\"{PicturePalette.Surface}\"/>");
            sb.Append(CultureInfo.InvariantCulture, $"<text x=\"{x + 8:F1}\" y=\"{y + 4:F1}\" font-weight=\"bold\" fill=\"{PicturePalette.Text}\">{WebUtility.HtmlEncode(s.Code)}</text>");
        }

        sb.Append(CultureInfo.InvariantCulture, $"<text x=\"{Left}\" y=\"{Height + 34}\" fill=\"{PicturePalette.TextSoft}\">Longitude (deg east) vs geodetic latitude (deg north); dashed lines: baselines with light-travel time d/c.</text>");
        sb.Append("</svg>");
        return sb.ToString();
    }

    private static double X(double lon) => Left + ((lon + 180) / 360 * PlotW);

    private static double Y(double lat) => Top + ((90 - lat) / 180 * PlotH);
}
