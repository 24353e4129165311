using System.Globalization;
using System.Text;
using EventReview.Core.Pictures;

namespace EventReview.Core.Chain;

/// <summary>
/// Draws one stage of the data-chain check as SVG: top panel recorded (black) and predicted (orange) output, bottom panel
/// the residual with the ±z threshold band (the on-source threshold in robust sigma) and the largest on-source excursion
/// marked; the on-source window tinted; x axis in seconds relative to the candidate; settling time greyed; a one-line caption. Long traces are reduced to min/max pairs per pixel column.
/// </summary>
public static class DataChainSvg
{
    private const double Width = 820;
    private const double Left = 70;
    private const double Right = 15;
    private const double PanelHeight = 150;

    /// <summary>Renders the stage as a standalone SVG document.</summary>
    /// <param name="trace">Traces from <see cref="DataChainCheck.RunWithTraces"/>.</param>
    /// <param name="result">The stage's result (same stage).</param>
    /// <param name="centerGps">Candidate time, GPS seconds (x = 0).</param>
    /// <param name="windowSeconds">On-source half window, seconds (tinted).</param>
    public static string Render(ChainStageTrace trace, ChainStageResult result, double centerGps, double windowSeconds)
    {
        ArgumentNullException.ThrowIfNull(trace);
        ArgumentNullException.ThrowIfNull(result);
        var sigmaThreshold = result.ThresholdSigma;
        var n = trace.Recorded.Length;
        var t0 = trace.StartGps - centerGps;
        var t1 = t0 + ((n - 1) / trace.SampleRateHz);
        double X(int i) => Math.Round(Left + ((i / (double)Math.Max(1, n - 1)) * (Width - Left - Right)), 2);
        var sb = new StringBuilder();
        var height = (2 * PanelHeight) + 90;
        sb.Append(F($"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{Width}\" height=\"{height}\" viewBox=\"0 0 {Width} {height}\" font-family=\"sans-serif\" font-size=\"11\">"));
        foreach (var top in new[] { 10.0, PanelHeight + 30 })
        {
            sb.Append(F($"<rect x=\"{Left}\" y=\"{top}\" width=\"{X(trace.FirstValid) - Left}\" height=\"{PanelHeight}\" fill=\"{PicturePalette.Rule}\"/>"));
            sb.Append(F($"<rect x=\"{X(trace.LastValid)}\" y=\"{top}\" width=\"{Width - Right - X(trace.LastValid)}\" height=\"{PanelHeight}\" fill=\"{PicturePalette.Rule}\"/>"));
            var a = Math.Clamp((int)Math.Round((centerGps - windowSeconds - trace.StartGps) * trace.SampleRateHz), 0, n - 1);
            var b = Math.Clamp((int)Math.Round((centerGps + windowSeconds - trace.StartGps) * trace.SampleRateHz), 0, n - 1);
            sb.Append(F($"<rect x=\"{X(a)}\" y=\"{top}\" width=\"{X(b) - X(a)}\" height=\"{PanelHeight}\" fill=\"{PicturePalette.WarmTint}\"/>"));
            sb.Append(F($"<rect x=\"{Left}\" y=\"{top}\" width=\"{Width - Left - Right}\" height=\"{PanelHeight}\" fill=\"none\" stroke=\"{PicturePalette.Text}\"/>"));
        }

        var outMax = Math.Max(1e-300, trace.Recorded.Concat(trace.Predicted).Max(Math.Abs));
        Polyline(sb, trace.Recorded, X, 10, outMax, PicturePalette.Text);
        Polyline(sb, trace.Predicted, X, 10, outMax, PicturePalette.Warm);
        var resMax = Math.Max(1.2 * sigmaThreshold * result.RobustSigma, trace.Residual.Skip(trace.FirstValid).Take(trace.LastValid - trace.FirstValid + 1).Select(Math.Abs).DefaultIfEmpty(0).Max());
        var y0 = PanelHeight + 30;
        foreach (var s in new[] { sigmaThreshold, -sigmaThreshold })
        {
            var y = Math.Round(y0 + (PanelHeight / 2) - (s * result.RobustSigma / Math.Max(resMax, 1e-300) * (PanelHeight / 2 - 4)), 2);
            sb.Append(F($"<line x1=\"{Left}\" y1=\"{y}\" x2=\"{Width - Right}\" y2=\"{y}\" stroke=\"{PicturePalette.Brick}\" stroke-dasharray=\"4,3\"/>"));
        }

        Polyline(sb, trace.Residual, X, y0, resMax, PicturePalette.Ink);
        var best = (int)Math.Round((result.MaxExcessGps - trace.StartGps) * trace.SampleRateHz);
        sb.Append(F($"<line x1=\"{X(Math.Clamp(best, 0, n - 1))}\" y1=\"{y0}\" x2=\"{X(Math.Clamp(best, 0, n - 1))}\" y2=\"{y0 + PanelHeight}\" stroke=\"{PicturePalette.Brick}\"/>"));
        sb.Append(F($"<text x=\"{Left + 4}\" y=\"24\">recorded (black) and predicted (orange) output</text>"));
        sb.Append(F($"<text x=\"{Left + 4}\" y=\"{y0 + 14}\">residual, ±{sigmaThreshold:0.00} robust sigma (on-source threshold) dashed; on-source window tinted</text>"));
        var axisY = y0 + PanelHeight + 14;
        sb.Append(F($"<text x=\"{Left}\" y=\"{axisY}\">{t0:0.###} s</text><text x=\"{Width - Right}\" y=\"{axisY}\" text-anchor=\"end\">{t1:0.###} s</text>"));
        sb.Append(F($"<text x=\"{Width / 2}\" y=\"{axisY}\" text-anchor=\"middle\">seconds relative to the candidate</text>"));
        sb.Append(F($"<text x=\"4\" y=\"{height - 8}\">{Caption(result)}</text></svg>"));
        return sb.ToString();
    }

    /// <summary>The one-line caption drawn under the stage picture.</summary>
    public static string Caption(ChainStageResult r) => F(
        $"Stage {r.Stage}: on-source max {r.MaxExcessSigma:0.0} sigma (threshold {r.ThresholdSigma:0.00}); {r.OutsideWindowCount} excursion(s) outside the window; {r.SkippedStartSeconds:0.###} s skipped at each end (grey); {r.Judgement.Word}.");

    private static void Polyline(StringBuilder sb, double[] v, Func<int, double> x, double top, double max, string colour)
    {
        var columns = (int)(Width - Left - Right);
        var step = Math.Max(1, v.Length / columns);
        var points = new StringBuilder();
        for (var i = 0; i < v.Length; i += step)
        {
            var end = Math.Min(v.Length, i + step);
            var (lo, hi) = (double.MaxValue, double.MinValue);
            for (var j = i; j < end; j++)
            {
                lo = Math.Min(lo, v[j]);
                hi = Math.Max(hi, v[j]);
            }

            foreach (var value in step == 1 ? new[] { lo } : new[] { lo, hi })
            {
                var y = top + (PanelHeight / 2) - (value / max * ((PanelHeight / 2) - 4));
                points.Append(F($"{x(i)},{Math.Round(y, 2)} "));
            }
        }

        sb.Append(F($"<polyline fill=\"none\" stroke=\"{colour}\" stroke-width=\"1\" points=\"{points.ToString().TrimEnd()}\"/>"));
    }

    private static string F(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
