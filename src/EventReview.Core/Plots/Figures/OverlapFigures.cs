using System.Globalization;
using EventReview.Core.Signal.Overlap;

namespace EventReview.Core.Plots.Figures;

/// <summary>Plot-model figures of an overlap check: the aligned whitened strain, the correlation against lag, the off-source overlaps.</summary>
public static class OverlapFigures
{
    /// <summary>
    /// The two sites' whitened, band-passed strain overlaid after <paramref name="siteB"/> is brought to the best lag and
    /// phase; the compared window shaded.
    /// </summary>
    public static PlotFigure Overlay(OverlapResult result, string siteA = "A", string siteB = "B")
    {
        ArgumentNullException.ThrowIfNull(result);
        var ci = CultureInfo.InvariantCulture;
        var t = result.PlotTimesSeconds.Select(v => v * 1e3).ToArray();
        double ymax = Math.Max(1e-12, result.PlotA.Concat(result.PlotB).Select(Math.Abs).DefaultIfEmpty(1).Max()) * 1.1;
        double w = result.WindowSeconds * 1e3 / 2;
        string turn = result.PhaseRadians is { } ph ? string.Create(ci, $", phase turned {-double.RadiansToDegrees(ph):+0;−0}°") : string.Empty;
        var elements = new List<PlotElement>
        {
            PlotBand.Rectangle(-w, w, -ymax, ymax) with { Colour = PlotPalette.Shade, Label = string.Create(ci, $"compared window ({result.WindowSeconds * 1e3:G3} ms)") },
            new PlotLine(t, result.PlotA) { Colour = PlotPalette.Ink, Label = $"{siteA} as recorded" },
            new PlotLine(t, result.PlotB) { Colour = PlotPalette.Warm, Dashed = true, Label = string.Create(ci, $"{siteB} aligned: arrival offset {result.LagSeconds * 1e3:+0.00;−0.00} ms{turn}") },
        };
        return new PlotFigure(
            string.Create(ci, $"{siteA} and {siteB} aligned at the best lag: overlap {result.Overlap:F2}; the two traces should rise and fall together in the window"),
            new PlotAxis("time from candidate (ms)", t.DefaultIfEmpty(-1).Min(), t.DefaultIfEmpty(1).Max()),
            new PlotAxis("whitened, band-passed strain (dimensionless)", -ymax, ymax), elements);
    }

    /// <summary>Correlation for both signs and its envelope against lag, the best lag ± its 1σ uncertainty shaded.</summary>
    public static PlotFigure CorrelationCurve(OverlapResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var ci = CultureInfo.InvariantCulture;
        var lagMs = result.LagsSeconds.Select(v => v * 1e3).ToArray();
        double span = Math.Max(result.MaxLagSeconds * 1e3 * 1.15, 1);
        double lag = result.RefinedLagSeconds * 1e3;
        var elements = new List<PlotElement>
        {
            PlotBand.Rectangle(lagMs.DefaultIfEmpty(-span).Min(), lagMs.DefaultIfEmpty(span).Max(), -1, 1) with { Colour = PlotPalette.Shade, Opacity = 0.6, Label = "searched lags" },
            new PlotLine([-span, span], [0, 0]) { Colour = PlotPalette.Grey, Width = 1 },
        };
        if (result.LagUncertaintySeconds is { } sigma)
        {
            elements.Add(PlotBand.Rectangle(lag - (sigma * 1e3), lag + (sigma * 1e3), -1, 1) with { Colour = PlotPalette.Green, Opacity = 0.25, Label = "best lag ± 1σ" });
        }

        elements.Add(new PlotLine(lagMs, result.Correlation) { Colour = PlotPalette.Ink, Label = "correlation, same sign" });
        elements.Add(new PlotLine(lagMs, result.Correlation.Select(v => -v).ToArray()) { Colour = PlotPalette.Warm, Dashed = true, Label = "correlation, opposite sign" });
        if (result.Envelope is { } env)
        {
            elements.Add(new PlotLine(lagMs, env) { Colour = PlotPalette.Green, Width = 2.2, Label = "envelope (any phase)" });
        }

        string sigmaText = result.LagUncertaintySeconds is { } s ? string.Create(ci, $" ± {s * 1e3:0.00}") : string.Empty;
        return new PlotFigure(string.Create(ci, $"Correlation against lag: best lag {lag:F2}{sigmaText} ms, overlap {result.Overlap:F2}; look for one clear peak inside the searched lags"),
            new PlotAxis("lag = arrival(A) − arrival(B) (ms)", -span, span), new PlotAxis("normalised correlation (dimensionless)", -1, 1), elements) { LegendRight = true };
    }

    /// <summary>Histogram of the off-source overlaps with the on-source value marked.</summary>
    public static PlotFigure OffSourceHistogram(OverlapResult result, int bins = 30)
    {
        ArgumentNullException.ThrowIfNull(result);
        var off = result.OffSourceOverlaps;
        double hi = Math.Max(1e-6, Math.Max(result.Overlap, off.DefaultIfEmpty(0).Max()) * 1.05);
        var counts = new int[Math.Max(1, bins)];
        foreach (var v in off)
        {
            counts[Math.Clamp((int)(v / hi * counts.Length), 0, counts.Length - 1)]++;
        }

        double top = Math.Max(1, counts.Max()) * 1.15;
        var xs = new List<double>();
        var ys = new List<double>();
        for (int i = 0; i < counts.Length; i++)
        {
            xs.AddRange([i * hi / counts.Length, (i + 1) * hi / counts.Length]);
            ys.AddRange([counts[i], counts[i]]);
        }

        var elements = new List<PlotElement>
        {
            new PlotBand(xs, xs.Select(_ => 0.0).ToArray(), ys) { Colour = PlotPalette.Shade, Label = "off-source windows" },
            new PlotLine([result.Overlap, result.Overlap], [0, top]) { Colour = PlotPalette.Warm, Width = 2.2, Label = "candidate" },
        };
        string caption = off.Length == 0
            ? "No off-source overlaps were computed: the line marks the candidate alone, with nothing to compare it to"
            : string.Create(CultureInfo.InvariantCulture, $"{off.Length} off-source overlaps, candidate {result.Overlap:F2}, empirical p = {result.PValue:G3}; the line should stand clear of the pile");
        return new PlotFigure(caption, new PlotAxis("overlap statistic (dimensionless)", 0, hi), new PlotAxis("off-source windows (count)", 0, top), elements) { LegendRight = true };
    }
}
