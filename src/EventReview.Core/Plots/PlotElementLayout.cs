namespace EventReview.Core.Plots;

/// <summary>Lowers one element to marks inside a frame: lines clipped to the axes (Liang–Barsky), bands clamped, maps in blocks.</summary>
internal static class PlotElementLayout
{
    public static void Add(PlotElement element, PlotFrame f, ColourScale? bar, List<PlotMark> marks)
    {
        switch (element)
        {
            case PlotLine line:
                Line(line, f, marks);
                break;
            case PlotBand band:
                Band(band, f, marks);
                break;
            case PlotPoints points:
                for (int k = 0; k < Math.Min(points.Xs.Count, points.Ys.Count); k++)
                {
                    double x = f.Px(points.Xs[k]), y = f.Py(points.Ys[k]);
                    if (f.Inside(x, y))
                    {
                        marks.Add(new DotMark(PlotLayout.P(x, y), points.Radius, points.Colour));
                    }
                }

                break;
            case PlotText text:
                double tx = f.Px(text.X), ty = f.Py(text.Y);
                if (f.Inside(tx, ty))
                {
                    marks.Add(new TextMark(PlotLayout.P(tx, ty), text.Text, PlotLayout.TickSize, text.Colour, "start", false, false));
                }

                break;
            case PlotPolygon polygon:
                var corners = Enumerable.Range(0, Math.Min(polygon.Xs.Count, polygon.Ys.Count))
                    .Select(k => (X: f.Px(polygon.Xs[k]), Y: f.Py(polygon.Ys[k]))).Where(p => !double.IsNaN(p.X + p.Y))
                    .Select(p => PlotLayout.P(Math.Clamp(p.X, f.Left, f.Right), Math.Clamp(p.Y, f.Top, f.Bottom))).ToArray();
                if (corners.Length > 2)
                {
                    marks.Add(new AreaMark(corners, polygon.Colour, polygon.Opacity));
                }

                break;
            case PlotHeatMap map:
                HeatMap(map, f, bar!, marks);
                break;
        }
    }

    private static void Line(PlotLine line, PlotFrame f, List<PlotMark> marks)
    {
        var run = new List<PlotPoint>();
        void Flush()
        {
            if (run.Count > 1)
            {
                marks.Add(new LineMark(run.ToArray(), line.Colour, line.Width, line.Dashed));
            }

            run.Clear();
        }

        int n = Math.Min(line.Xs.Count, line.Ys.Count);
        for (int k = 1; k < n; k++)
        {
            double x0 = f.Px(line.Xs[k - 1]), y0 = f.Py(line.Ys[k - 1]), x1 = f.Px(line.Xs[k]), y1 = f.Py(line.Ys[k]);
            if (!Clip(f, ref x0, ref y0, ref x1, ref y1))
            {
                Flush();
                continue;
            }

            var a = PlotLayout.P(x0, y0);
            if (run.Count == 0 || run[^1] != a)
            {
                Flush();
                run.Add(a);
            }

            run.Add(PlotLayout.P(x1, y1));
        }

        Flush();
    }

    /// <summary>Liang–Barsky clipping of a segment to the frame; false when nothing is left or a value is not plottable.</summary>
    private static bool Clip(PlotFrame f, ref double x0, ref double y0, ref double x1, ref double y1)
    {
        if (double.IsNaN(x0) || double.IsNaN(y0) || double.IsNaN(x1) || double.IsNaN(y1))
        {
            return false;
        }

        double dx = x1 - x0, dy = y1 - y0, t0 = 0, t1 = 1;
        foreach (var (p, q) in new[] { (-dx, x0 - f.Left), (dx, f.Right - x0), (-dy, y0 - f.Top), (dy, f.Bottom - y0) })
        {
            if (p == 0)
            {
                if (q < 0)
                {
                    return false;
                }

                continue;
            }

            double r = q / p;
            if (p < 0)
            {
                t0 = Math.Max(t0, r);
            }
            else
            {
                t1 = Math.Min(t1, r);
            }

            if (t0 > t1)
            {
                return false;
            }
        }

        (x0, y0, x1, y1) = (x0 + (t0 * dx), y0 + (t0 * dy), x0 + (t1 * dx), y0 + (t1 * dy));
        return true;
    }

    private static void Band(PlotBand band, PlotFrame f, List<PlotMark> marks)
    {
        int n = new[] { band.Xs.Count, band.Lower.Count, band.Upper.Count }.Min();
        var upper = new List<PlotPoint>();
        var lower = new List<PlotPoint>();
        for (int k = 0; k < n; k++)
        {
            double x = f.Px(band.Xs[k]), ya = f.Py(band.Upper[k]), yb = f.Py(band.Lower[k]);
            if (double.IsNaN(x) || double.IsNaN(ya) || double.IsNaN(yb))
            {
                continue;
            }

            x = Math.Clamp(x, f.Left, f.Right);
            upper.Add(PlotLayout.P(x, Math.Clamp(ya, f.Top, f.Bottom)));
            lower.Add(PlotLayout.P(x, Math.Clamp(yb, f.Top, f.Bottom)));
        }

        if (upper.Count > 1)
        {
            lower.Reverse();
            marks.Add(new AreaMark(upper.Concat(lower).ToArray(), band.Colour, band.Opacity));
        }
    }

    private static void HeatMap(PlotHeatMap map, PlotFrame f, ColourScale bar, List<PlotMark> marks)
    {
        var xe = Edges(map.XCentres, f.X.Scale == AxisScale.Log);
        var ye = Edges(map.YCentres, f.Y.Scale == AxisScale.Log);
        int nx = map.XCentres.Count, ny = map.YCentres.Count;
        if (nx == 0 || ny == 0)
        {
            return;
        }

        int cols = Math.Min(PlotHeatMap.MaxColumns, nx), rows = Math.Min(PlotHeatMap.MaxRows, ny);
        for (int r = 0; r < rows; r++)
        {
            int j0 = r * ny / rows, j1 = Math.Max(j0 + 1, (r + 1) * ny / rows);
            double ya = Math.Clamp(f.Py(ye[j1]), f.Top, f.Bottom), yb = Math.Clamp(f.Py(ye[j0]), f.Top, f.Bottom);
            int c = 0;
            while (c < cols)
            {
                int shade = bar.Shade(BlockMax(map, c, cols, j0, j1));
                int end = c + 1;
                while (end < cols && bar.Shade(BlockMax(map, end, cols, j0, j1)) == shade)
                {
                    end++;
                }

                if (shade > 0)
                {
                    int i0 = c * nx / cols, i1 = Math.Max(i0 + 1, end * nx / cols);
                    double xa = Math.Clamp(f.Px(xe[i0]), f.Left, f.Right), xb = Math.Clamp(f.Px(xe[i1]), f.Left, f.Right);
                    if (!double.IsNaN(xa + xb + ya + yb) && xb > xa && yb > ya)
                    {
                        marks.Add(new AreaMark([PlotLayout.P(xa, ya), PlotLayout.P(xb, ya), PlotLayout.P(xb, yb), PlotLayout.P(xa, yb)], ColourScale.Colour(shade), 1));
                    }
                }

                c = end;
            }
        }
    }

    private static double BlockMax(PlotHeatMap map, int column, int columns, int j0, int j1)
    {
        int nx = map.XCentres.Count;
        int i0 = column * nx / columns, i1 = Math.Max(i0 + 1, (column + 1) * nx / columns);
        double best = double.NaN;
        for (int i = i0; i < i1; i++)
        {
            for (int j = j0; j < j1; j++)
            {
                double v = map.Values[i][j];
                best = double.IsNaN(best) || v > best ? v : best;
            }
        }

        return best;
    }

    /// <summary>Cell edges half-way between centres (geometric mean on a log axis), the outer ones half a cell out.</summary>
    internal static double[] Edges(IReadOnlyList<double> c, bool log)
    {
        int n = c.Count;
        var e = new double[n + 1];
        if (n == 1)
        {
            (e[0], e[1]) = log ? (c[0] / 1.05, c[0] * 1.05) : (c[0] - 0.5, c[0] + 0.5);
            return e;
        }

        for (int k = 1; k < n; k++)
        {
            e[k] = log ? Math.Sqrt(c[k - 1] * c[k]) : (c[k - 1] + c[k]) / 2;
        }

        e[0] = log ? c[0] * c[0] / e[1] : c[0] - (e[1] - c[0]);
        e[n] = log ? c[n - 1] * c[n - 1] / e[n - 1] : c[n - 1] + (c[n - 1] - e[n - 1]);
        return e;
    }
}
