using System.Globalization;
using System.Net;
using System.Text;
using System.Xml.Linq;

namespace EventReview.Core.Plots;

/// <summary>
/// The SVG back end: writes a <see cref="PlotDrawing"/> as a self-contained SVG document with one element per mark
/// (polyline, polygon, circle, text) and the caption as a <c>text</c> of class "caption"; invariant culture, numbers to
/// 0.01 px, so the same drawing always gives the same bytes. <see cref="Read"/> recovers the drawing from such a
/// document, which is how the dossier's PDF draws a stored picture natively.
/// </summary>
public static class PlotSvg
{
    /// <summary>Value of the root's <c>data-plot</c> attribute that marks documents written here.</summary>
    public const string Format = "eventreview-plot/1";

    /// <summary>The SVG of <paramref name="figure"/>.</summary>
    public static string Write(PlotFigure figure) => Write(PlotLayout.Lay(figure));

    /// <summary>The SVG of <paramref name="d"/>.</summary>
    public static string Write(PlotDrawing d)
    {
        ArgumentNullException.ThrowIfNull(d);
        var sb = new StringBuilder();
        sb.Append(CultureInfo.InvariantCulture, $"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{d.Width}\" height=\"{d.Height}\" viewBox=\"0 0 {d.Width} {d.Height}\" font-family=\"DejaVu Sans, sans-serif\" font-size=\"12\" data-plot=\"{Format}\">");
        sb.Append(CultureInfo.InvariantCulture, $"<rect width=\"100%\" height=\"100%\" fill=\"{PlotPalette.Surface}\"/>");
        foreach (var m in d.Marks)
        {
            switch (m)
            {
                case LineMark l:
                    sb.Append("<polyline fill=\"none\" stroke=\"").Append(l.Colour).Append("\" stroke-width=\"").Append(F(l.Width)).Append('"');
                    sb.Append(l.Dashed ? " stroke-dasharray=\"6 4\"" : string.Empty).Append(" points=\"").Append(Points(l.Points)).Append("\"/>");
                    break;
                case AreaMark a:
                    sb.Append("<polygon fill=\"").Append(a.Colour).Append('"');
                    sb.Append(a.Opacity < 1 ? " fill-opacity=\"" + F(a.Opacity) + "\"" : string.Empty).Append(" points=\"").Append(Points(a.Points)).Append("\"/>");
                    break;
                case DotMark c:
                    sb.Append("<circle cx=\"").Append(F(c.Centre.X)).Append("\" cy=\"").Append(F(c.Centre.Y)).Append("\" r=\"").Append(F(c.Radius));
                    sb.Append("\" fill=\"").Append(c.Colour).Append("\"/>");
                    break;
                case TextMark t:
                    Text(sb, t, null);
                    break;
            }
        }

        var lines = PlotLayout.CaptionLines(d.Caption, d.Width);
        for (int k = 0; k < lines.Count; k++)
        {
            double y = d.Height - 10 - ((lines.Count - 1 - k) * PlotLayout.CaptionLineHeight);
            Text(sb, new TextMark(PlotPoint.Of(d.Width / 2.0, y), lines[k], 12, PlotPalette.Text, "middle", false, true), "caption");
        }

        sb.Append("</svg>");
        return sb.ToString();
    }

    /// <summary>The drawing in an SVG written by <see cref="Write(PlotDrawing)"/>, or null for any other document.</summary>
    public static PlotDrawing? Read(string svg)
    {
        ArgumentNullException.ThrowIfNull(svg);
        XElement root;
        try
        {
            root = XElement.Parse(svg);
        }
        catch (System.Xml.XmlException)
        {
            return null;
        }

        if ((string?)root.Attribute("data-plot") != Format)
        {
            return null;
        }

        var marks = new List<PlotMark>();
        string caption = string.Empty;
        foreach (var e in root.Elements())
        {
            string A(string name) => (string?)e.Attribute(name) ?? string.Empty;
            switch (e.Name.LocalName)
            {
                case "polyline":
                    marks.Add(new LineMark(ParsePoints(A("points")), A("stroke"), D(A("stroke-width")), e.Attribute("stroke-dasharray") is not null));
                    break;
                case "polygon":
                    marks.Add(new AreaMark(ParsePoints(A("points")), A("fill"), e.Attribute("fill-opacity") is null ? 1 : D(A("fill-opacity"))));
                    break;
                case "circle":
                    marks.Add(new DotMark(new PlotPoint(D(A("cx")), D(A("cy"))), D(A("r")), A("fill")));
                    break;
                case "text" when A("class") == "caption":
                    caption = caption.Length == 0 ? e.Value : caption + " " + e.Value;
                    break;
                case "text":
                    marks.Add(new TextMark(new PlotPoint(D(A("x")), D(A("y"))), e.Value, D(A("font-size")), A("fill"), A("text-anchor"),
                        e.Attribute("transform") is not null, A("font-style") == "italic"));
                    break;
            }
        }

        return new PlotDrawing((int)D(A0(root, "width")), (int)D(A0(root, "height")), caption, marks);
    }

    private static string A0(XElement e, string name) => (string?)e.Attribute(name) ?? "0";

    private static void Text(StringBuilder sb, TextMark t, string? cls)
    {
        sb.Append("<text");
        if (cls is not null)
        {
            sb.Append(" class=\"").Append(cls).Append('"');
        }

        sb.Append(" x=\"").Append(F(t.At.X)).Append("\" y=\"").Append(F(t.At.Y)).Append("\" font-size=\"").Append(F(t.Size))
          .Append("\" fill=\"").Append(t.Colour).Append("\" text-anchor=\"").Append(t.Anchor).Append('"');
        sb.Append(t.Italic ? " font-style=\"italic\"" : string.Empty);
        sb.Append(t.Rotated ? $" transform=\"rotate(-90 {F(t.At.X)} {F(t.At.Y)})\"" : string.Empty);
        sb.Append('>').Append(WebUtility.HtmlEncode(t.Text)).Append("</text>");
    }

    private static string Points(IReadOnlyList<PlotPoint> points) => string.Join(' ', points.Select(p => F(p.X) + "," + F(p.Y)));

    private static PlotPoint[] ParsePoints(string text) =>
        text.Split(' ', StringSplitOptions.RemoveEmptyEntries).Select(s => s.Split(',')).Where(p => p.Length == 2)
            .Select(p => new PlotPoint(D(p[0]), D(p[1]))).ToArray();

    private static string F(double v) => v.ToString("0.##", CultureInfo.InvariantCulture);

    private static double D(string s) => double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out var v) ? v : 0;
}
