using System.Numerics;
using EventReview.Core.Chain;
using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Filters;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Chain;

/// <summary>The chain residual's spectrum against the expected noise.</summary>
public partial class DataChainCheckTests
{
    [Fact]
    public void Residual_spectrum_lies_on_the_expected_white_noise_and_shows_a_weak_line_the_rms_ratio_hides()
    {
        var (input, output, _) = Simulate(seed: 5, burstAmplitudeSigma: 0);
        var stated = Stage with { ExpectedNoiseRms = NoiseSigma };
        var (report, traces) = DataChainCheck.RunWithTraces(input, [output], [stated], Start.AddSeconds(10));
        var fig = ChainSpectrumFigure.Build(traces[0], report.Stages[0]);
        // One-sided density of white noise of RMS σ: σ·√(2/fs) (Parseval; Heinzel, Rüdiger and Schilling 2002, eq. 24).
        double level = NoiseSigma * Math.Sqrt(2 / Fs);
        var expected = fig.Elements.OfType<PlotLine>().Single(l => l.Label!.StartsWith("expected", StringComparison.Ordinal));
        Assert.Equal(level, expected.Ys[0], level * 1e-12);
        var residual = fig.Elements.OfType<PlotLine>().Single(l => l.Label!.StartsWith("residual", StringComparison.Ordinal));
        var sorted = residual.Ys.Order().ToArray();
        Assert.InRange(sorted[sorted.Length / 2] / level, 0.8, 1.2);
        Assert.Equal(Fs / 2, fig.X.Max);
        Assert.Contains("(output units/√Hz)", fig.Y.Label);

        // A sine of 0.3 σ at 100 Hz added to the output raises the residual RMS by only √(1 + 0.045) ≈ 2 %, a reassuring ratio;
        // its spectrum rises well above the expected line at 100 Hz.
        var withLine = new TimeSeries(Start, Fs, output.Samples.Select((v, i) => v + (0.3 * NoiseSigma * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 100 * i / Fs))).ToArray());
        var (r2, t2) = DataChainCheck.RunWithTraces(input, [withLine], [stated], Start.AddSeconds(10));
        Assert.InRange(r2.Stages[0].NoiseRatio!.Value, 0.95, 1.1);
        var line = ChainSpectrumFigure.Build(t2[0], r2.Stages[0]).Elements.OfType<PlotLine>().Single(l => l.Label!.StartsWith("residual", StringComparison.Ordinal));
        double peak = Enumerable.Range(0, line.Xs.Count).Where(k => Math.Abs(line.Xs[k] - 100) < 2).Max(k => line.Ys[k]);
        Assert.True(peak > 3 * level, $"peak {peak:G3} against the expected {level:G3}");
        FigureChecks(fig);
    }
}
