using System.Globalization;
using EventReview.Core.Signal.Overlap;

namespace EventReview.Core.Signal.Pictures;

/// <summary>SVG pictures of an overlap check. Each method returns a complete, self-contained SVG document (a few tens of kB).</summary>
public static class OverlapPictures
{
    /// <summary>The two whitened, band-passed waveforms overlaid after B is shifted by the lag and multiplied by the sign.</summary>
    public static string Overlay(OverlapResult result, string siteA = "A", string siteB = "B")
    {
        ArgumentNullException.ThrowIfNull(result);
        var t = result.PlotTimesSeconds.Select(v => v * 1e3).ToArray();
        double ymax = Math.Max(1e-12, result.PlotA.Concat(result.PlotB).Select(Math.Abs).DefaultIfEmpty(1).Max());
        var p = new SvgPlot(t.DefaultIfEmpty(0).Min(), t.DefaultIfEmpty(1).Max(), -ymax * 1.05, ymax * 1.05);
        double w = result.WindowSeconds * 1e3 / 2;
        p.Rect(-w, -ymax * 1.05, w, ymax * 1.05, "#eef3fb");
        p.Polyline(t, result.PlotA, "#1f5fbf");
        p.Polyline(t, result.PlotB, "#d0562a");
        p.Axes("time from candidate (ms)", "whitened, band-passed strain (dimensionless)");
        string flip = result.Sign < 0 ? "flipped, " : string.Empty;
        p.Text(p.PlotLeft + 8, p.PlotTop + 16, $"{siteA}", "start", "fill=\"#1f5fbf\"");
        p.Text(p.PlotLeft + 8, p.PlotTop + 32, $"{siteB} ({flip}shifted {result.LagSeconds * 1e3:+0.00;-0.00} ms)", "start", "fill=\"#d0562a\"");
        return p.Finish(string.Create(CultureInfo.InvariantCulture,
            $"{siteA} and {siteB} after shift and sign {result.Sign:+0;-0}: overlap {result.Overlap:F2} over the shaded {result.WindowSeconds * 1e3:G3} ms window"));
    }

    /// <summary>Correlation against lag for sign +1 and sign −1, with the searched window shaded and the best lag marked.</summary>
    public static string CorrelationCurve(OverlapResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var lagMs = result.LagsSeconds.Select(v => v * 1e3).ToArray();
        double span = Math.Max(result.MaxLagSeconds * 1e3 * 1.15, 1);
        var p = new SvgPlot(-span, span, -1, 1);
        p.Rect(lagMs.Min(), -1, lagMs.Max(), 1, "#eef3fb");
        p.Line(-span, 0, span, 0, "#999");
        p.Polyline(lagMs, result.Correlation, "#1f5fbf", 1.6);
        p.Polyline(lagMs, result.Correlation.Select(v => -v).ToArray(), "#d0562a", 1.6);
        p.Line(result.LagSeconds * 1e3, -1, result.LagSeconds * 1e3, 1, "black", "stroke-dasharray=\"4 3\"");
        p.Axes("lag = arrival(A) - arrival(B) (ms)", "normalised correlation (dimensionless)");
        p.Text(p.PlotLeft + 8, p.PlotTop + 16, "sign +1", "start", "fill=\"#1f5fbf\"");
        p.Text(p.PlotLeft + 8, p.PlotTop + 32, "sign -1", "start", "fill=\"#d0562a\"");
        return p.Finish(string.Create(CultureInfo.InvariantCulture,
            $"best lag {result.RefinedLagSeconds * 1e3:F2} ms, sign {result.Sign:+0;-0}, overlap {result.Overlap:F2}; other sign best {result.AlternativeOverlap:F2} at {result.AlternativeLagSeconds * 1e3:F2} ms; shaded: searched lags"));
    }

    /// <summary>Histogram of the off-source overlaps with the on-source value marked; a short note when there are none.</summary>
    public static string OffSourceHistogram(OverlapResult result, int bins = 30)
    {
        ArgumentNullException.ThrowIfNull(result);
        var off = result.OffSourceOverlaps;
        double hi = Math.Max(result.Overlap, off.DefaultIfEmpty(0).Max()) * 1.05;
        var counts = new int[Math.Max(1, bins)];
        foreach (var v in off)
        {
            counts[Math.Min(counts.Length - 1, (int)(v / hi * counts.Length))]++;
        }

        var p = new SvgPlot(0, Math.Max(hi, 1e-6), 0, Math.Max(1, counts.DefaultIfEmpty(0).Max()) * 1.1);
        for (int i = 0; i < counts.Length; i++)
        {
            p.Rect(i * hi / counts.Length, 0, (i + 1) * hi / counts.Length, counts[i], "#9db4d8", "stroke=\"white\" stroke-width=\"0.5\"");
        }

        p.Line(result.Overlap, 0, result.Overlap, Math.Max(1, counts.DefaultIfEmpty(0).Max()) * 1.1, "#d0562a", "stroke-width=\"2\"");
        p.Axes("overlap statistic (max |correlation| over lags and signs)", "off-source windows (count)");
        string caption = off.Length == 0
            ? "no off-source overlaps were computed; the line marks the candidate"
            : string.Create(CultureInfo.InvariantCulture, $"{off.Length} off-source overlaps; candidate {result.Overlap:F2} (line), empirical p = {result.PValue:G3}");
        return p.Finish(caption);
    }
}
