using System.Globalization;
using EventReview.Core.Pictures;
using EventReview.Core.Signal.Overlap;

namespace EventReview.Core.Signal.Pictures;

/// <summary>SVG pictures of an overlap check. Each method returns a complete, self-contained SVG document (a few tens of kB).</summary>
public static class OverlapPictures
{
    /// <summary>The two whitened, band-passed waveforms overlaid after B is shifted by the lag and turned by −phase.</summary>
    public static string Overlay(OverlapResult result, string siteA = "A", string siteB = "B")
    {
        ArgumentNullException.ThrowIfNull(result);
        var t = result.PlotTimesSeconds.Select(v => v * 1e3).ToArray();
        double ymax = Math.Max(1e-12, result.PlotA.Concat(result.PlotB).Select(Math.Abs).DefaultIfEmpty(1).Max());
        var p = new SvgPlot(t.DefaultIfEmpty(0).Min(), t.DefaultIfEmpty(1).Max(), -ymax * 1.05, ymax * 1.05);
        double w = result.WindowSeconds * 1e3 / 2;
        p.Rect(-w, -ymax * 1.05, w, ymax * 1.05, PicturePalette.Shade);
        p.Polyline(t, result.PlotA, PicturePalette.Ink);
        p.Polyline(t, result.PlotB, PicturePalette.Warm);
        p.Axes("time from candidate (ms)", "whitened, band-passed strain (dimensionless)");
        string turn = result.PhaseRadians is { } ph ? string.Create(CultureInfo.InvariantCulture, $", phase {-double.RadiansToDegrees(ph):+0;-0}°") : string.Empty;
        p.Text(p.PlotLeft + 8, p.PlotTop + 16, $"{siteA}: reference, untouched", "start", $"fill=\"{PicturePalette.Ink}\"");
        p.Text(p.PlotLeft + 8, p.PlotTop + 32, string.Create(CultureInfo.InvariantCulture, $"{siteB}: realigned (time {result.LagSeconds * 1e3:+0.00;-0.00} ms{turn})"), "start", $"fill=\"{PicturePalette.Warm}\"");
        return p.Finish(string.Create(CultureInfo.InvariantCulture,
            $"{siteB} realigned onto {siteA}: the traces should agree inside the shaded {result.WindowSeconds * 1e3:G3} ms (overlap {result.Overlap:F2})"));
    }

    /// <summary>Correlation (sign +1 and −1) and its envelope against lag, with the best lag ± its uncertainty marked.</summary>
    public static string CorrelationCurve(OverlapResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var lagMs = result.LagsSeconds.Select(v => v * 1e3).ToArray();
        double span = Math.Max(result.MaxLagSeconds * 1e3 * 1.15, 1);
        var p = new SvgPlot(-span, span, -1, 1);
        p.Rect(lagMs.Min(), -1, lagMs.Max(), 1, PicturePalette.Shade);
        p.Line(-span, 0, span, 0, PicturePalette.Grey);
        double lag = result.RefinedLagSeconds * 1e3;
        if (result.LagUncertaintySeconds is { } sigma)
        {
            p.Rect(lag - (sigma * 1e3), -1, lag + (sigma * 1e3), 1, PicturePalette.Green, "fill-opacity=\"0.25\"");
        }

        p.Polyline(lagMs, result.Correlation, PicturePalette.Ink, 1.4);
        p.Polyline(lagMs, result.Correlation.Select(v => -v).ToArray(), PicturePalette.Warm, 1.4);
        if (result.Envelope is { } env)
        {
            p.Polyline(lagMs, env, PicturePalette.Green, 2.2);
        }

        p.Line(lag, -1, lag, 1, PicturePalette.Text, "stroke-dasharray=\"4 3\"");
        p.Axes("lag = arrival(A) - arrival(B) (ms)", "normalised correlation (dimensionless)");
        p.Text(p.PlotLeft + 8, p.PlotTop + 16, "sign +1", "start", $"fill=\"{PicturePalette.Ink}\"");
        p.Text(p.PlotLeft + 8, p.PlotTop + 32, "sign -1", "start", $"fill=\"{PicturePalette.Warm}\"");
        p.Text(p.PlotLeft + 8, p.PlotTop + 48, "envelope (any phase); band: lag ± 1σ", "start", $"fill=\"{PicturePalette.Green}\"");
        string sigmaText = result.LagUncertaintySeconds is { } s ? string.Create(CultureInfo.InvariantCulture, $" ± {s * 1e3:0.00}") : string.Empty;
        string phaseText = result.PhaseRadians is { } ph ? string.Create(CultureInfo.InvariantCulture, $", phase {double.RadiansToDegrees(ph):0}°") : string.Empty;
        return p.Finish(string.Create(CultureInfo.InvariantCulture,
            $"best lag {lag:F2}{sigmaText} ms{phaseText}, overlap {result.Overlap:F2}; shaded: searched lags"));
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
            p.Rect(i * hi / counts.Length, 0, (i + 1) * hi / counts.Length, counts[i], PicturePalette.Shade, $"stroke=\"{PicturePalette.Surface}\" stroke-width=\"0.5\"");
        }

        p.Line(result.Overlap, 0, result.Overlap, Math.Max(1, counts.DefaultIfEmpty(0).Max()) * 1.1, PicturePalette.Warm, "stroke-width=\"2\"");
        p.Axes("overlap statistic (max |correlation| over lags and signs)", "off-source windows (count)");
        string caption = off.Length == 0
            ? "no off-source overlaps were computed; the line marks the candidate"
            : string.Create(CultureInfo.InvariantCulture, $"{off.Length} off-source overlaps; candidate {result.Overlap:F2} (line), empirical p = {result.PValue:G3}");
        return p.Finish(caption);
    }
}
