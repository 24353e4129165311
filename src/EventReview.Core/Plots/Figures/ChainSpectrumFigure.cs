using System.Globalization;
using EventReview.Core.Chain;
using EventReview.Core.Formatting;
using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// The spectrum of one stage's residual (recorded − predicted) against the noise expected of it: the residual's amplitude
/// spectral density over the settled part of the trace (Welch, periodic Hann, 50 % overlap, median of segments of up to
/// 1 s; output units/√Hz), log-log up to Nyquist, against the flat one-sided density of white noise of the expected RMS,
/// σ·√(2/fs) (Parseval: its integral over 0..fs/2 is σ²). The expected RMS is the stage's stated one when the model
/// states it, otherwise the off-source robust σ (said so in the legend). A residual that rises above the line in a band
/// is structure the model does not explain.
/// </summary>
public static class ChainSpectrumFigure
{
    /// <summary>The figure of <paramref name="trace"/>'s residual with <paramref name="result"/>'s expected noise.</summary>
    public static PlotFigure Build(ChainStageTrace trace, ChainStageResult result)
    {
        ArgumentNullException.ThrowIfNull(trace);
        ArgumentNullException.ThrowIfNull(result);
        var ci = CultureInfo.InvariantCulture;
        double fs = trace.SampleRateHz;
        int from = Math.Max(0, trace.FirstValid), to = Math.Min(trace.Residual.Length - 1, trace.LastValid);
        int n = Math.Max(0, to - from + 1);
        int seg = 1;
        while (seg * 2 <= Math.Min(n / 2, (int)Math.Round(fs)))
        {
            seg *= 2;
        }

        seg = Math.Max(8, seg);
        bool stated = result.ExpectedNoiseRms is > 0;
        double sigma = stated ? result.ExpectedNoiseRms!.Value : result.RobustSigma;
        double level = sigma * Math.Sqrt(2 / fs);
        double fLo = fs / seg, fHi = fs / 2;
        var elements = new List<PlotElement>();
        var values = new List<double> { level };
        if (n >= seg)
        {
            var psd = Welch.Estimate(trace.Residual.AsSpan(from, n), fs, new WelchOptions(seg, Average: WelchAverage.Median));
            var (f, v) = SpectrumColumns.Reduce(psd.FrequencyStepHz, psd.Asd(), fLo, fHi);
            values.AddRange(v);
            elements.Add(new PlotLine(f, v) { Colour = PlotPalette.Ink, Width = 1.2, Label = string.Create(ci, $"residual ({psd.Segments} segments of {seg / fs:0.###} s, median)") });
        }

        elements.Add(new PlotLine([fLo, fHi], [level, level])
        {
            Colour = PlotPalette.Warm, Dashed = true, Width = 2,
            Label = stated
                ? $"expected: white noise of the stated RMS {ScientificFormat.Format(sigma, 3)}"
                : $"no expected RMS stated: white noise of the off-source robust σ {ScientificFormat.Format(sigma, 3)}",
        });
        var positive = values.Where(x => x > 0 && double.IsFinite(x)).DefaultIfEmpty(1).ToList();
        double yLo = Math.Pow(10, Math.Floor(Math.Log10(positive.Min()))), yHi = Math.Pow(10, Math.Ceiling(Math.Log10(positive.Max()) + 0.01));
        string caption = string.Create(ci,
            $"Stage {result.Stage} residual spectrum against the expected noise{(result.NoiseRatio is { } r ? string.Create(ci, $" (off-source RMS {r:0.00} × expected)") : string.Empty)}; the residual should lie on the dashed line, with no band above it");
        return new PlotFigure(caption, new PlotAxis("frequency (Hz)", fLo, fHi, AxisScale.Log),
            new PlotAxis("residual amplitude spectral density (output units/√Hz)", yLo, yHi, AxisScale.Log), elements) { LegendRight = true };
    }
}
