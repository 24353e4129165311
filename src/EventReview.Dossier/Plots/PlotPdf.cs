using System.Globalization;
using EventReview.Core.Plots;
using PdfSharp.Drawing;

namespace EventReview.Dossier.Plots;

/// <summary>
/// The PDF back end of the plot model: draws a <see cref="PlotDrawing"/> with PDFsharp's vector operations (lines,
/// polygons, ellipses, text in DejaVu Sans), scaled into a box on the page, so a figure in <c>summary.pdf</c> is the
/// same drawing as its SVG, mark for mark, and its text can be searched. The caption is left to the caller (the
/// dossier numbers it).
/// </summary>
public static class PlotPdf
{
    /// <summary>
    /// Draws <paramref name="d"/> with its top left corner at (<paramref name="left"/>, <paramref name="top"/>) pt and
    /// <paramref name="width"/> pt wide (height in proportion, without the caption strip); returns the height used (pt).
    /// </summary>
    public static double Draw(XGraphics gfx, PlotDrawing d, double left, double top, double width)
    {
        ArgumentNullException.ThrowIfNull(gfx);
        ArgumentNullException.ThrowIfNull(d);
        double s = width / Math.Max(1, d.Width);
        XPoint P(PlotPoint p) => new(left + (p.X * s), top + (p.Y * s));
        double height = (d.Height - 26 - ((PlotLayout.CaptionLines(d.Caption, d.Width).Count - 1) * PlotLayout.CaptionLineHeight)) * s;
        gfx.DrawRectangle(XBrushes.White, left, top, width, height);
        foreach (var m in d.Marks)
        {
            switch (m)
            {
                case LineMark l when l.Points.Count > 1:
                    var pen = new XPen(Colour(l.Colour, 1), l.Width * s) { LineJoin = XLineJoin.Round };
                    if (l.Dashed)
                    {
                        pen.DashStyle = XDashStyle.Dash;
                    }

                    gfx.DrawLines(pen, l.Points.Select(P).ToArray());
                    break;
                case AreaMark a when a.Points.Count > 2:
                    gfx.DrawPolygon(new XSolidBrush(Colour(a.Colour, a.Opacity)), a.Points.Select(P).ToArray(), XFillMode.Winding);
                    break;
                case DotMark c:
                    var r = c.Radius * s;
                    var at = P(c.Centre);
                    gfx.DrawEllipse(new XSolidBrush(Colour(c.Colour, 1)), at.X - r, at.Y - r, 2 * r, 2 * r);
                    break;
                case TextMark t:
                    Text(gfx, t, P(t.At), s);
                    break;
            }
        }

        return height;
    }

    private static void Text(XGraphics gfx, TextMark t, XPoint at, double s)
    {
        var font = new XFont(DejaVuFontResolver.FamilyName, t.Size * s, t.Italic ? XFontStyleEx.Italic : XFontStyleEx.Regular);
        double w = gfx.MeasureString(t.Text, font).Width;
        double dx = t.Anchor switch { "middle" => -w / 2, "end" => -w, _ => 0 };
        var brush = new XSolidBrush(Colour(t.Colour, 1));
        if (t.Rotated)
        {
            var state = gfx.Save();
            gfx.RotateAtTransform(-90, at);
            gfx.DrawString(t.Text, font, brush, new XPoint(at.X + dx, at.Y));
            gfx.Restore(state);
        }
        else
        {
            gfx.DrawString(t.Text, font, brush, new XPoint(at.X + dx, at.Y));
        }
    }

    /// <summary>A "#rrggbb" colour with opacity; anything else is drawn black.</summary>
    internal static XColor Colour(string hex, double opacity)
    {
        int alpha = (int)Math.Round(Math.Clamp(opacity, 0, 1) * 255);
        if (hex.Length == 7 && hex[0] == '#' && int.TryParse(hex.AsSpan(1), NumberStyles.HexNumber, CultureInfo.InvariantCulture, out var rgb))
        {
            return XColor.FromArgb(alpha, (rgb >> 16) & 0xff, (rgb >> 8) & 0xff, rgb & 0xff);
        }

        return XColor.FromArgb(alpha, 0, 0, 0);
    }
}
