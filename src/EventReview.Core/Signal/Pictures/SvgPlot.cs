using System.Globalization;
using System.Net;
using System.Text;
using EventReview.Core.Pictures;

namespace EventReview.Core.Signal.Pictures;

/// <summary>Minimal SVG plotting frame: linear axes, ticks, labels and a caption. Invariant culture throughout.</summary>
internal sealed class SvgPlot
{
    public const int Width = 720;
    public const int Height = 400;
    private const int Left = 70, Right = 20, Top = 20, Bottom = 80;
    private readonly StringBuilder _sb = new();
    private readonly double _x0, _x1, _y0, _y1;

    public SvgPlot(double x0, double x1, double y0, double y1)
    {
        (_x0, _x1) = x1 > x0 ? (x0, x1) : (x0 - 0.5, x0 + 0.5);
        (_y0, _y1) = y1 > y0 ? (y0, y1) : (y0 - 0.5, y0 + 0.5);
        _sb.Append(CultureInfo.InvariantCulture, $"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{Width}\" height=\"{Height}\" viewBox=\"0 0 {Width} {Height}\" font-family=\"sans-serif\" font-size=\"12\">");
        _sb.Append($"<rect width=\"100%\" height=\"100%\" fill=\"{PicturePalette.Surface}\"/>");
    }

    public double PlotLeft => Left;

    public double PlotRight => Width - Right;

    public double PlotTop => Top;

    public double PlotBottom => Height - Bottom;

    public static string F(double v) => v.ToString("0.##", CultureInfo.InvariantCulture);

    public static string Esc(string s) => WebUtility.HtmlEncode(s);

    public double X(double v) => Left + ((v - _x0) / (_x1 - _x0) * (Width - Left - Right));

    public double Y(double v) => Height - Bottom - ((v - _y0) / (_y1 - _y0) * (Height - Top - Bottom));

    public void Raw(string svg) => _sb.Append(svg);

    public void Rect(double x0, double y0, double x1, double y1, string fill, string extra = "")
    {
        double xa = Math.Min(X(x0), X(x1)), xb = Math.Max(X(x0), X(x1)), ya = Math.Min(Y(y0), Y(y1)), yb = Math.Max(Y(y0), Y(y1));
        _sb.Append(CultureInfo.InvariantCulture, $"<rect x=\"{F(xa)}\" y=\"{F(ya)}\" width=\"{F(xb - xa)}\" height=\"{F(yb - ya)}\" fill=\"{fill}\" {extra}/>");
    }

    public void Line(double x0, double y0, double x1, double y1, string stroke, string extra = "") =>
        _sb.Append(CultureInfo.InvariantCulture, $"<line x1=\"{F(X(x0))}\" y1=\"{F(Y(y0))}\" x2=\"{F(X(x1))}\" y2=\"{F(Y(y1))}\" stroke=\"{stroke}\" {extra}/>");

    public void Polyline(IReadOnlyList<double> xs, IReadOnlyList<double> ys, string stroke, double width = 1.2)
    {
        _sb.Append("<polyline fill=\"none\" stroke=\"").Append(stroke).Append("\" stroke-width=\"").Append(F(width)).Append("\" points=\"");
        for (int i = 0; i < Math.Min(xs.Count, ys.Count); i++)
        {
            _sb.Append(F(X(xs[i]))).Append(',').Append(F(Y(ys[i]))).Append(' ');
        }

        _sb.Append("\"/>");
    }

    public void Text(double px, double py, string text, string anchor = "start", string extra = "") =>
        _sb.Append(CultureInfo.InvariantCulture, $"<text x=\"{F(px)}\" y=\"{F(py)}\" text-anchor=\"{anchor}\" {extra}>{Esc(text)}</text>");

    public void Axes(string xLabel, string yLabel)
    {
        _sb.Append(CultureInfo.InvariantCulture, $"<rect x=\"{Left}\" y=\"{Top}\" width=\"{Width - Left - Right}\" height=\"{Height - Top - Bottom}\" fill=\"none\" stroke=\"{PicturePalette.Text}\"/>");
        foreach (var t in Ticks(_x0, _x1))
        {
            _sb.Append(CultureInfo.InvariantCulture, $"<line x1=\"{F(X(t))}\" y1=\"{F(PlotBottom)}\" x2=\"{F(X(t))}\" y2=\"{F(PlotBottom + 5)}\" stroke=\"{PicturePalette.Text}\"/>");
            Text(X(t), PlotBottom + 18, Tick(t), "middle");
        }

        foreach (var t in Ticks(_y0, _y1))
        {
            _sb.Append(CultureInfo.InvariantCulture, $"<line x1=\"{Left - 5}\" y1=\"{F(Y(t))}\" x2=\"{Left}\" y2=\"{F(Y(t))}\" stroke=\"{PicturePalette.Text}\"/>");
            Text(Left - 8, Y(t) + 4, Tick(t), "end");
        }

        Text((Left + PlotRight) / 2, PlotBottom + 36, xLabel, "middle");
        Text(16, (Top + PlotBottom) / 2, yLabel, "middle", $"transform=\"rotate(-90 16 {F((Top + PlotBottom) / 2)})\"");
    }

    public string Finish(string caption)
    {
        Text(Width / 2.0, Height - 12, caption, "middle", "font-style=\"italic\"");
        _sb.Append("</svg>");
        return _sb.ToString();
    }

    private static string Tick(double v) => Math.Abs(v) < 1e-12 ? "0" : v.ToString("G4", CultureInfo.InvariantCulture);

    private static IEnumerable<double> Ticks(double a, double b)
    {
        double span = b - a;
        double raw = span / 6;
        double mag = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double step = new[] { 1, 2, 5, 10 }.Select(m => m * mag).First(s => s >= raw);
        for (double t = Math.Ceiling(a / step) * step; t <= b + (step * 1e-9); t += step)
        {
            yield return Math.Round(t / step) * step;
        }
    }
}
