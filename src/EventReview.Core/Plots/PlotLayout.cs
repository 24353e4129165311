namespace EventReview.Core.Plots;

/// <summary>
/// Lowers a <see cref="PlotFigure"/> to marks in pixels (<see cref="PlotDrawing"/>): elements clipped to the axes, the
/// frame with ticks and labels, the colour bar, the legend. Pure and deterministic: the same figure gives the same marks,
/// so the SVG and PDF back ends draw the same picture.
/// </summary>
public static class PlotLayout
{
    /// <summary>Tick and legend text size (px).</summary>
    public const double TickSize = 12;

    /// <summary>Axis label size (px).</summary>
    public const double LabelSize = 13;

    /// <summary>Lays out <paramref name="figure"/>.</summary>
    /// <exception cref="ArgumentException">When a map has no colour bar.</exception>
    public static PlotDrawing Lay(PlotFigure figure)
    {
        ArgumentNullException.ThrowIfNull(figure);
        if (figure.ColourBar is null && figure.Elements.Any(e => e is PlotHeatMap))
        {
            throw new ArgumentException("A figure with a map needs a colour bar (ColourBar): the style shows the scale of every map.", nameof(figure));
        }

        var frame = PlotFrame.For(figure);
        var marks = new List<PlotMark>();
        foreach (var e in figure.Elements)
        {
            PlotElementLayout.Add(e, frame, figure.ColourBar, marks);
        }

        Axes(frame, marks);
        if (figure.ColourBar is { } bar)
        {
            ColourBar(bar, frame, figure.Width, marks);
        }

        Legend(figure, frame, marks);
        return new PlotDrawing(figure.Width, figure.Height, figure.Caption, marks);
    }

    private static void Axes(PlotFrame f, List<PlotMark> marks)
    {
        if (f.X.Scale == AxisScale.Hidden)
        {
            return;
        }

        marks.Add(new LineMark([P(f.Left, f.Top), P(f.Right, f.Top), P(f.Right, f.Bottom), P(f.Left, f.Bottom), P(f.Left, f.Top)], PlotPalette.Text, 1, false));
        var (x0, x1) = f.X.Range();
        foreach (var t in f.X.Scale == AxisScale.Log ? PlotTicks.Log(x0, x1) : f.X.LinearTicks(6))
        {
            double px = f.Px(t);
            marks.Add(new LineMark([P(px, f.Bottom), P(px, f.Bottom + 5)], PlotPalette.Text, 1, false));
            marks.Add(Text(px, f.Bottom + 19, PlotTicks.Label(t, f.X.Scale), TickSize, "middle"));
        }

        marks.Add(Text((f.Left + f.Right) / 2, f.Bottom + 40, f.X.Label, LabelSize, "middle"));
        if (f.Y.Scale == AxisScale.Hidden)
        {
            return;
        }

        var (y0, y1) = f.Y.Range();
        if (f.Y.Categories is { } names)
        {
            for (int k = 0; k < names.Count; k++)
            {
                double py = f.Py(k);
                marks.Add(new LineMark([P(f.Left, py), P(f.Right, py)], PlotPalette.Rule, 0.6, false));
                marks.Add(Text(f.Left - 8, py + 4, names[k], TickSize, "end"));
            }
        }

        foreach (var t in f.Y.Categories is not null ? [] : f.Y.Scale == AxisScale.Log ? PlotTicks.Log(y0, y1) : f.Y.LinearTicks(5))
        {
            double py = f.Py(t);
            marks.Add(new LineMark([P(f.Left - 5, py), P(f.Left, py)], PlotPalette.Text, 1, false));
            marks.Add(Text(f.Left - 8, py + 4, PlotTicks.Label(t, f.Y.Scale), TickSize, "end"));
        }

        marks.Add(new TextMark(P(18, (f.Top + f.Bottom) / 2), f.Y.Label, LabelSize, PlotPalette.Text, "middle", true, false));
    }

    private static void ColourBar(ColourScale bar, PlotFrame f, int width, List<PlotMark> marks)
    {
        double x = f.Right + 24, h = f.Bottom - f.Top;
        for (int s = 1; s <= ColourScale.Shades; s++)
        {
            double ya = f.Bottom - (s / (double)ColourScale.Shades * h), yb = f.Bottom - ((s - 1) / (double)ColourScale.Shades * h);
            marks.Add(new AreaMark([P(x, ya), P(x + 16, ya), P(x + 16, yb), P(x, yb)], ColourScale.Colour(s), 1));
        }

        marks.Add(new LineMark([P(x, f.Top), P(x + 16, f.Top), P(x + 16, f.Bottom), P(x, f.Bottom), P(x, f.Top)], PlotPalette.Text, 1, false));
        var axis = new PlotAxis(bar.Label, bar.Min, bar.Max);
        var (lo, hi) = axis.Range();
        foreach (var t in PlotTicks.Linear(lo, hi, 4))
        {
            double py = f.Bottom - (axis.Fraction(t) * h);
            marks.Add(new LineMark([P(x + 16, py), P(x + 20, py)], PlotPalette.Text, 1, false));
            marks.Add(Text(x + 23, py + 4, PlotTicks.Label(t, AxisScale.Linear), TickSize, "start"));
        }

        string label = bar.Note is null ? bar.Label : bar.Label + ", " + bar.Note;
        marks.Add(new TextMark(P(width - 14, (f.Top + f.Bottom) / 2), label, TickSize, PlotPalette.Text, "middle", true, false));
    }

    private static void Legend(PlotFigure figure, PlotFrame f, List<PlotMark> marks)
    {
        var entries = figure.Elements.Where(e => !string.IsNullOrEmpty(e.Label) && e is not PlotText).ToList();
        if (entries.Count == 0)
        {
            return;
        }

        const double row = 18;
        double textWidth = entries.Max(e => e.Label!.Length) * TickSize * 0.56;
        double w = Math.Min(f.Right - f.Left - 16, textWidth + 40), h = (entries.Count * row) + 8;
        var (x, y) = LegendCorner(figure.LegendRight, figure.LegendBottom, f, w, h, marks);
        marks.Add(new AreaMark([P(x, y), P(x + w, y), P(x + w, y + h), P(x, y + h)], PlotPalette.Surface, 0.85));
        marks.Add(new LineMark([P(x, y), P(x + w, y), P(x + w, y + h), P(x, y + h), P(x, y)], PlotPalette.Grey, 0.8, false));
        for (int k = 0; k < entries.Count; k++)
        {
            var e = entries[k];
            double cy = y + 4 + (k * row) + (row / 2);
            switch (e)
            {
                case PlotBand band:
                    marks.Add(new AreaMark([P(x + 6, cy - 6), P(x + 28, cy - 6), P(x + 28, cy + 6), P(x + 6, cy + 6)], band.Colour, band.Opacity));
                    break;
                case PlotPolygon polygon:
                    marks.Add(new AreaMark([P(x + 6, cy - 6), P(x + 28, cy - 6), P(x + 28, cy + 6), P(x + 6, cy + 6)], polygon.Colour, polygon.Opacity));
                    break;
                case PlotPoints pts:
                    marks.Add(new DotMark(P(x + 17, cy), Math.Max(3, pts.Radius), pts.Colour));
                    break;
                case PlotLine line:
                    marks.Add(new LineMark([P(x + 6, cy), P(x + 28, cy)], line.Colour, Math.Max(2, line.Width), line.Dashed));
                    break;
                default:
                    marks.Add(new AreaMark([P(x + 6, cy - 6), P(x + 28, cy - 6), P(x + 28, cy + 6), P(x + 6, cy + 6)], e.Colour, 1));
                    break;
            }

            marks.Add(new TextMark(P(x + 34, cy + 4), e.Label!, TickSize, PlotPalette.Text, "start", false, false));
        }
    }

    /// <summary>
    /// The corner of the axes where the legend hides the fewest drawn points (lines and dots); the preferred corner wins ties.
    /// </summary>
    private static (double X, double Y) LegendCorner(bool right, bool bottom, PlotFrame f, double w, double h, List<PlotMark> marks)
    {
        double first = bottom ? f.Bottom - 8 - h : f.Top + 8, second = bottom ? f.Top + 8 : f.Bottom - 8 - h;
        (double X, double Y)[] corners =
        [
            (right ? f.Right - 8 - w : f.Left + 8, first),
            (right ? f.Left + 8 : f.Right - 8 - w, first),
            (right ? f.Right - 8 - w : f.Left + 8, second),
            (right ? f.Left + 8 : f.Right - 8 - w, second),
        ];
        var points = marks.SelectMany(m => m switch
        {
            LineMark l when l.Width > 1 || l.Points.Count > 2 => Densify(l.Points),
            DotMark d => [d.Centre],
            _ => [],
        }).ToList();
        int Hidden((double X, double Y) c) => points.Count(p => p.X >= c.X && p.X <= c.X + w && p.Y >= c.Y && p.Y <= c.Y + h);
        var best = corners[0];
        int fewest = Hidden(best);
        foreach (var c in corners.Skip(1))
        {
            int n = Hidden(c);
            if (n < fewest)
            {
                (best, fewest) = (c, n);
            }
        }

        return best;
    }

    /// <summary>The points of a polyline with extra points every ~8 px along long segments, so a straight line crossing a box counts.</summary>
    private static IEnumerable<PlotPoint> Densify(IReadOnlyList<PlotPoint> points)
    {
        for (int k = 0; k < points.Count; k++)
        {
            yield return points[k];
            if (k + 1 < points.Count)
            {
                double dx = points[k + 1].X - points[k].X, dy = points[k + 1].Y - points[k].Y;
                int n = (int)(Math.Sqrt((dx * dx) + (dy * dy)) / 8);
                for (int j = 1; j < n; j++)
                {
                    yield return new PlotPoint(points[k].X + (dx * j / n), points[k].Y + (dy * j / n));
                }
            }
        }
    }

    /// <summary>Height of one caption line (px).</summary>
    public const double CaptionLineHeight = 15;

    /// <summary>
    /// The caption broken at spaces into lines that fit <paramref name="width"/> px of 12 px italic text (at most 6.9 px a
    /// character, our estimate for DejaVu Sans; a word longer than a line keeps its own line).
    /// </summary>
    public static IReadOnlyList<string> CaptionLines(string caption, int width)
    {
        ArgumentNullException.ThrowIfNull(caption);
        int perLine = Math.Max(20, (int)((width - 24) / 6.9));
        var lines = new List<string>();
        var line = string.Empty;
        foreach (var word in caption.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            if (line.Length > 0 && line.Length + 1 + word.Length > perLine)
            {
                lines.Add(line);
                line = word;
            }
            else
            {
                line = line.Length == 0 ? word : line + " " + word;
            }
        }

        lines.Add(line);
        return lines;
    }

    internal static PlotPoint P(double x, double y) => PlotPoint.Of(x, y);

    private static TextMark Text(double x, double y, string text, double size, string anchor) =>
        new(P(x, y), text, size, PlotPalette.Text, anchor, false, false);
}
