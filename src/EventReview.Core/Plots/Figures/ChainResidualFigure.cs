using System.Globalization;
using EventReview.Core.Chain;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// One stage of the data-chain check: the residual (recorded − predicted output) in units of its off-source robust σ,
/// zoomed on the candidate (four on-source windows either side, inside the settled part of the trace), against the
/// ±threshold band; the on-source window shaded and the largest on-source excursion marked. Long traces are reduced to
/// the minimum and maximum of each of at most 700 columns, so no spike is lost.
/// </summary>
public static class ChainResidualFigure
{
    private const int Columns = 700;

    /// <summary>The figure of <paramref name="trace"/> and its <paramref name="result"/>; x = 0 at <paramref name="centerGps"/>.</summary>
    public static PlotFigure Build(ChainStageTrace trace, ChainStageResult result, double centerGps, double windowSeconds)
    {
        ArgumentNullException.ThrowIfNull(trace);
        ArgumentNullException.ThrowIfNull(result);
        var ci = CultureInfo.InvariantCulture;
        double sigma = result.RobustSigma > 0 ? result.RobustSigma : 1;
        double Time(int i) => trace.StartGps + (i / trace.SampleRateHz) - centerGps;
        double half = Math.Max(4 * windowSeconds, 8 / trace.SampleRateHz);
        int from = Math.Max(trace.FirstValid, (int)Math.Floor((centerGps - half - trace.StartGps) * trace.SampleRateHz));
        int to = Math.Min(trace.LastValid, (int)Math.Ceiling((centerGps + half - trace.StartGps) * trace.SampleRateHz));
        if (to <= from)
        {
            (from, to) = (trace.FirstValid, Math.Max(trace.FirstValid + 1, trace.LastValid));
        }

        var xs = new List<double>();
        var ys = new List<double>();
        int step = Math.Max(1, (to - from + 1) / Columns);
        for (int i = from; i <= to; i += step)
        {
            int end = Math.Min(to + 1, i + step);
            double lo = double.MaxValue, hi = double.MinValue;
            for (int j = i; j < end; j++)
            {
                lo = Math.Min(lo, trace.Residual[j] / sigma);
                hi = Math.Max(hi, trace.Residual[j] / sigma);
            }

            xs.Add(Time(i));
            ys.Add(lo);
            if (step > 1)
            {
                xs.Add(Time(i));
                ys.Add(hi);
            }
        }

        double z = result.ThresholdSigma;
        double ymax = Math.Max(1.25 * z, ys.Select(Math.Abs).DefaultIfEmpty(1).Max() * 1.1);
        double t0 = Time(from), t1 = Time(to);
        double peak = result.MaxExcessGps - centerGps;
        var elements = new List<PlotElement>
        {
            PlotBand.Rectangle(-windowSeconds, windowSeconds, -ymax, ymax) with { Colour = PlotPalette.Warm, Opacity = 0.12, Label = string.Create(ci, $"on-source window ±{windowSeconds:0.###} s") },
            PlotBand.Rectangle(t0, t1, -z, z) with { Colour = PlotPalette.Shade, Label = string.Create(ci, $"±{z:0.00} σ threshold (on-source)") },
            new PlotLine(xs, ys) { Colour = PlotPalette.Ink, Width = 1, Label = "residual, recorded − predicted" },
            new PlotLine([peak, peak], [-ymax, ymax]) { Colour = PlotPalette.Warm, Dashed = true, Label = string.Create(ci, $"largest on-source excursion, {result.MaxExcessSigma:0.0} σ") },
        };
        string caption = string.Create(ci,
            $"Stage {result.Stage} residual: on-source maximum {result.MaxExcessSigma:0.0} σ against ±{z:0.00} σ; {result.Judgement.Word}. It should stay inside the band");
        return new PlotFigure(caption, new PlotAxis("time from candidate (s)", t0, t1),
            new PlotAxis("residual (robust σ of the off-source residual)", -ymax, ymax), elements) { LegendRight = true };
    }
}
