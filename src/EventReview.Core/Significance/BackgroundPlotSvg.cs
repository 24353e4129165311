using System.Globalization;
using System.Security;
using System.Text;
using EventReview.Core.Pictures;
using EventReview.Core.Statistics;

namespace EventReview.Core.Significance;

/// <summary>
/// Draws the cumulative background rate (1/s, log scale) against the ranking statistic as a standalone SVG:
/// the candidate marked, the 3 sigma and 5 sigma false-alarm levels over the observing time drawn as
/// rates, labelled axes with units and a one-line caption. Invariant-culture numbers, no external resources.
/// </summary>
public static class BackgroundPlotSvg
{
    private const double Left = 78, Right = 24, Top = 20, Bottom = 72;

    /// <summary>Renders the plot.</summary>
    /// <param name="result">A background estimate.</param>
    /// <param name="width">Width in px (&gt;= 200).</param>
    /// <param name="height">Height in px (&gt;= 150).</param>
    /// <returns>An SVG document as text.</returns>
    public static string Render(BackgroundResult result, int width = 720, int height = 440)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentOutOfRangeException.ThrowIfLessThan(width, 200);
        ArgumentOutOfRangeException.ThrowIfLessThan(height, 150);

        // rate of a Poisson false-alarm process that gives probability p over T_obs: -ln(1 - p) / T_obs
        double LevelRate(double sigma) => -Math.Log(1 - GaussianTail.Q(sigma)) / result.ObservingTimeSeconds;
        var rate3 = LevelRate(3);
        var rate5 = LevelRate(5);

        var curve = result.Curve;
        var rates = curve.Select(p => p.RateHz).Append(result.FarHz).Append(rate3).Append(rate5).Where(r => r > 0).ToList();
        var yMax = Math.Ceiling(Math.Log10(rates.Max()) + 0.01);
        var yMin = Math.Floor(Math.Log10(rates.Min()) - 0.01);
        var stats = curve.Select(p => p.Statistic).Append(result.CandidateStatistic).ToList();
        var xMin = Math.Floor(stats.Min());
        var xMax = Math.Ceiling(stats.Max() * 1.05);
        if (xMax <= xMin)
        {
            xMax = xMin + 1;
        }

        var plotW = width - Left - Right;
        var plotH = height - Top - Bottom;
        double X(double s) => Left + ((s - xMin) / (xMax - xMin) * plotW);
        double Y(double rate) => Top + ((yMax - Math.Log10(rate)) / (yMax - yMin) * plotH);

        var svg = new StringBuilder();
        svg.Append(F($"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{width}\" height=\"{height}\" viewBox=\"0 0 {width} {height}\" font-family=\"sans-serif\" font-size=\"12\">"));
        svg.Append(F($"<rect x=\"0\" y=\"0\" width=\"{width}\" height=\"{height}\" fill=\"{PicturePalette.Surface}\"/>"));
        svg.Append(F($"<rect x=\"{Left}\" y=\"{Top}\" width=\"{plotW:F1}\" height=\"{plotH:F1}\" fill=\"none\" stroke=\"{PicturePalette.TextSoft}\"/>"));

        // y decades
        for (var d = (int)yMin; d <= (int)yMax; d++)
        {
            var y = Y(Math.Pow(10, d));
            svg.Append(F($"<line x1=\"{Left}\" y1=\"{y:F1}\" x2=\"{Left + plotW:F1}\" y2=\"{y:F1}\" stroke=\"{PicturePalette.Rule}\"/>"));
            svg.Append(F($"<text x=\"{Left - 6}\" y=\"{y + 4:F1}\" text-anchor=\"end\">1e{d}</text>"));
        }

        // x ticks
        var xStep = NiceStep((xMax - xMin) / 8);
        for (var s = Math.Ceiling(xMin / xStep) * xStep; s <= xMax + 1e-9; s += xStep)
        {
            var x = X(s);
            svg.Append(F($"<line x1=\"{x:F1}\" y1=\"{Top + plotH:F1}\" x2=\"{x:F1}\" y2=\"{Top + plotH + 5:F1}\" stroke=\"{PicturePalette.TextSoft}\"/>"));
            svg.Append(F($"<text x=\"{x:F1}\" y=\"{Top + plotH + 18:F1}\" text-anchor=\"middle\">{s:G4}</text>"));
        }

        // sigma levels
        foreach (var (label, rate) in new[] { ("3σ", rate3), ("5σ", rate5) })
        {
            var y = Y(rate);
            svg.Append(F($"<line x1=\"{Left}\" y1=\"{y:F1}\" x2=\"{Left + plotW:F1}\" y2=\"{y:F1}\" stroke=\"{PicturePalette.Amber}\" stroke-dasharray=\"6 4\"/>"));
            svg.Append(F($"<text x=\"{Left + plotW - 4:F1}\" y=\"{y - 4:F1}\" text-anchor=\"end\" fill=\"{PicturePalette.Amber}\">{label} ({rate:G3} Hz)</text>"));
        }

        // cumulative background as a step line (count at or above each statistic)
        if (curve.Count > 0)
        {
            var path = new StringBuilder();
            path.Append(F($"M{X(curve[0].Statistic):F2},{Y(curve[0].RateHz):F2}"));
            for (var i = 1; i < curve.Count; i++)
            {
                path.Append(F($" H{X(curve[i].Statistic):F2} V{Y(curve[i].RateHz):F2}"));
            }

            path.Append(F($" H{X(curve[^1].Statistic + (xStep * 0.25)):F2}"));
            svg.Append(F($"<path d=\"{path}\" fill=\"none\" stroke=\"{PicturePalette.Ink}\" stroke-width=\"1.6\"/>"));
        }

        // candidate
        var cx = X(result.CandidateStatistic);
        var cy = Y(result.FarHz);
        svg.Append(F($"<line x1=\"{cx:F1}\" y1=\"{Top}\" x2=\"{cx:F1}\" y2=\"{Top + plotH:F1}\" stroke=\"{PicturePalette.Brick}\" stroke-dasharray=\"2 3\"/>"));
        svg.Append(F($"<circle cx=\"{cx:F1}\" cy=\"{cy:F1}\" r=\"5\" fill=\"{(result.FarIsBound ? PicturePalette.Surface : PicturePalette.Brick)}\" stroke=\"{PicturePalette.Brick}\" stroke-width=\"2\"/>"));
        svg.Append(F($"<text x=\"{cx - 8:F1}\" y=\"{cy - 9:F1}\" text-anchor=\"end\" fill=\"{PicturePalette.Brick}\">candidate {(result.FarIsBound ? "< " : string.Empty)}{result.FarHz:G3} Hz{(result.FarIsBound ? " (90 % bound)" : string.Empty)}</text>"));

        // axis labels and caption
        svg.Append(F($"<text x=\"{Left + (plotW / 2):F1}\" y=\"{Top + plotH + 38:F1}\" text-anchor=\"middle\">Ranking statistic (network SNR, dimensionless)</text>"));
        svg.Append(F($"<text transform=\"translate(16 {Top + (plotH / 2):F1}) rotate(-90)\" text-anchor=\"middle\">Background rate at or above statistic (1/s)</text>"));
        var caption = F($"Cumulative background of {result.SiteA}-{result.SiteB} coincidences from {result.Slides} time slides ({result.BackgroundSeconds:G4} s); candidate {result.CandidateStatistic:G4}: FAR {(result.FarIsBound ? "< " : string.Empty)}{result.FarHz:G3} Hz{(result.FarIsBound ? " (90 % upper bound: nothing as loud)" : string.Empty)}, {(result.SigmaIsBound ? "≥ " : string.Empty)}{result.Sigma:F1} sigma over {result.ObservingTimeSeconds:G4} s.");
        svg.Append(F($"<text x=\"{width / 2.0:F1}\" y=\"{height - 10}\" text-anchor=\"middle\" font-size=\"11\">{SecurityElement.Escape(caption)}</text>"));
        svg.Append("</svg>");
        return svg.ToString();
    }

    private static string F(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);

    private static double NiceStep(double raw)
    {
        var p = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        var m = raw / p;
        return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
    }
}
