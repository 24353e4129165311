using System.Globalization;
using EventReview.Core.Formatting;
using EventReview.Core.Significance;
using EventReview.Core.Statistics;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// The cumulative time-slide background of one pair: rate of background coincidences at or above each ranking statistic
/// (1/s, log axis) as a step line with the 1σ Poisson interval of each count (Gehrels 1986) divided by the background time; the rates that would make the candidate 3σ and 5σ
/// over the observing time (a Poisson false-alarm process: R = −ln(1 − Q(z)) / T_obs with the one-sided Gaussian tail Q);
/// the candidate's statistic and false-alarm rate, drawn as a bound with its confidence level when nothing in the
/// background was as loud.
/// </summary>
public static class BackgroundFigure
{
    /// <summary>
    /// Upper end of the 1σ (84.13 %) confidence interval of a Poisson mean after <paramref name="n"/> events:
    /// n + √(n + 3/4) + 1 (Gehrels 1986, ApJ 303, 336, eq. 7 with S = 1).
    /// </summary>
    public static double PoissonUpper(double n) => n + Math.Sqrt(n + 0.75) + 1;

    /// <summary>
    /// Lower end of the 1σ confidence interval of a Poisson mean after <paramref name="n"/> events:
    /// n (1 − 1/(9n) − 1/(3√n))³, 0 for n = 0 (Gehrels 1986, eq. 11 with S = 1).
    /// </summary>
    public static double PoissonLower(double n) => n <= 0 ? 0 : n * Math.Pow(1 - (1 / (9 * n)) - (1 / (3 * Math.Sqrt(n))), 3);

    /// <summary>The figure of <paramref name="result"/>.</summary>
    public static PlotFigure Build(BackgroundResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var ci = CultureInfo.InvariantCulture;
        double T = result.BackgroundSeconds > 0 ? result.BackgroundSeconds : 1;
        double Level(double sigma) => -Math.Log(1 - GaussianTail.Q(sigma)) / result.ObservingTimeSeconds;
        double r3 = Level(3), r5 = Level(5);
        var curve = result.Curve;
        var rates = curve.Select(p => p.RateHz).Append(result.FarHz).Append(r3).Append(r5).Where(r => r > 0 && double.IsFinite(r)).DefaultIfEmpty(1).ToList();
        double yLo = Math.Pow(10, Math.Floor(Math.Log10(rates.Min()) - 0.3)), yHi = Math.Pow(10, Math.Ceiling(Math.Log10(rates.Max()) + 0.1));
        var stats = curve.Select(p => p.Statistic).Append(result.CandidateStatistic).Where(double.IsFinite).DefaultIfEmpty(0).ToList();
        double xLo = Math.Floor(stats.Min()), xHi = Math.Ceiling(stats.Max() * 1.08) + 0.5;

        var sx = new List<double>();
        var sy = new List<double>();
        var lower = new List<double>();
        var upper = new List<double>();
        for (int i = 0; i < curve.Count; i++)
        {
            double end = i + 1 < curve.Count ? curve[i + 1].Statistic : Math.Max(curve[i].Statistic, result.CandidateStatistic) + ((xHi - xLo) * 0.02);
            double n = curve[i].Count, rate = curve[i].RateHz;
            foreach (var x in new[] { curve[i].Statistic, end })
            {
                sx.Add(x);
                sy.Add(rate);
                lower.Add(Math.Max(yLo, PoissonLower(n) / T));
                upper.Add(PoissonUpper(n) / T);
            }
        }

        string far = ScientificFormat.Format(result.FarHz, 3);
        string bound = result.FarIsBound ? string.Create(ci, $" < {far} Hz ({result.FarBoundConfidence ?? 0.9:0%} upper bound: nothing as loud)") : $" {far} Hz";
        var elements = new List<PlotElement>
        {
            new PlotBand(sx, lower, upper) { Colour = PlotPalette.Shade, Label = "Poisson 1σ interval of the count (Gehrels 1986)" },
            new PlotLine([xLo, xHi], [r3, r3]) { Colour = PlotPalette.Amber, Dashed = true, Width = 1.2, Label = string.Create(ci, $"3σ over the observing time ({ScientificFormat.Format(r3, 3)} Hz)") },
            new PlotLine([xLo, xHi], [r5, r5]) { Colour = PlotPalette.Alarm, Dashed = true, Width = 1.2, Label = string.Create(ci, $"5σ over the observing time ({ScientificFormat.Format(r5, 3)} Hz)") },
            new PlotLine(sx, sy) { Colour = PlotPalette.Ink, Width = 1.8, Label = "background rate at or above the statistic" },
            new PlotLine([result.CandidateStatistic, result.CandidateStatistic], [yLo, yHi]) { Colour = PlotPalette.Warm, Width = 1, Dashed = true },
        };
        if (result.FarIsBound)
        {
            elements.Add(new PlotLine([result.CandidateStatistic, result.CandidateStatistic], [yLo, result.FarHz]) { Colour = PlotPalette.Warm, Width = 2 });
            elements.Add(new PlotPoints([result.CandidateStatistic], [result.FarHz]) { Colour = PlotPalette.Warm, Radius = 6, Label = "candidate: FAR" + bound });
        }
        else
        {
            double n = Math.Max(1, result.Louder);
            elements.Add(new PlotLine([result.CandidateStatistic, result.CandidateStatistic], [Math.Max(yLo, PoissonLower(n) / T), PoissonUpper(n) / T]) { Colour = PlotPalette.Warm, Width = 3 });
            elements.Add(new PlotPoints([result.CandidateStatistic], [result.FarHz]) { Colour = PlotPalette.Warm, Radius = 6, Label = "candidate: FAR" + bound + " with its 1σ interval" });
        }

        string sigma = (result.SigmaIsBound ? "≥ " : string.Empty) + result.Sigma.ToString("0.0", ci) + " σ";
        string caption = string.Create(ci,
            $"Background of {result.SiteA}–{result.SiteB} from {result.Slides} time slides ({ScientificFormat.Format(result.BackgroundSeconds, 4)} s): candidate at {result.CandidateStatistic:0.##}, FAR{bound}, {sigma}. The candidate should sit far right of the curve");
        return new PlotFigure(caption, new PlotAxis("ranking statistic (network SNR, dimensionless)", xLo, xHi),
            new PlotAxis("background rate at or above (1/s)", yLo, yHi, AxisScale.Log), elements) { LegendRight = true, Height = 460 };
    }
}
