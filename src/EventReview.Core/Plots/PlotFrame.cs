namespace EventReview.Core.Plots;

/// <summary>
/// The pixel rectangle of a figure's axes and the mapping from data to pixels (y down). Values that cannot be placed
/// (NaN, or not positive on a log axis) map to NaN.
/// </summary>
public sealed record PlotFrame(double Left, double Top, double Right, double Bottom, PlotAxis X, PlotAxis Y)
{
    /// <summary>Width allowed per character of 12 px DejaVu Sans text (px), generous so that wide letters still fit.</summary>
    public const double CharWidth = 7.4;

    /// <summary>Pixel x of data value <paramref name="x"/>.</summary>
    public double Px(double x) => Left + (X.Fraction(x) * (Right - Left));

    /// <summary>Pixel y of data value <paramref name="y"/>.</summary>
    public double Py(double y) => Bottom - (Y.Fraction(y) * (Bottom - Top));

    /// <summary>Whether the pixel point lies inside the axes (with <paramref name="slack"/> px to spare).</summary>
    public bool Inside(double px, double py, double slack = 0.5) =>
        px >= Left - slack && px <= Right + slack && py >= Top - slack && py <= Bottom + slack;

    /// <summary>Lays out a figure's frame: room for ticks and labels, the colour bar and the caption; equal aspect if asked.</summary>
    public static PlotFrame For(PlotFigure figure)
    {
        ArgumentNullException.ThrowIfNull(figure);
        bool axes = figure.X.Scale != AxisScale.Hidden;
        double left = figure.Y.Scale == AxisScale.Hidden ? 16
            : figure.Y.Categories is { Count: > 0 } names ? Math.Max(84, 36 + (names.Max(n => n.Length) * CharWidth)) : 84;
        double right = figure.Width - 20 - (figure.ColourBar is null ? 0 : 112);
        double top = 14;
        double bottom = figure.Height - (axes ? 72 : 34) - ((PlotLayout.CaptionLines(figure.Caption, figure.Width).Count - 1) * PlotLayout.CaptionLineHeight);
        if (figure.EqualAspect)
        {
            var (x0, x1) = figure.X.Range();
            var (y0, y1) = figure.Y.Range();
            double want = (x1 - x0) / (y1 - y0), have = (right - left) / (bottom - top);
            if (have > want)
            {
                double w = (bottom - top) * want, mid = (left + right) / 2;
                (left, right) = (mid - (w / 2), mid + (w / 2));
            }
            else
            {
                double h = (right - left) / want, mid = (top + bottom) / 2;
                (top, bottom) = (mid - (h / 2), mid + (h / 2));
            }
        }

        return new PlotFrame(left, top, right, bottom, figure.X, figure.Y);
    }
}
