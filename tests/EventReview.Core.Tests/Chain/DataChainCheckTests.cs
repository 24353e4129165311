using System.Numerics;
using EventReview.Core.Chain;
using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Filters;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Chain;

public partial class DataChainCheckTests
{
    private const double Fs = 1024;
    private const int N = 16 * 1024;
    private static readonly GpsTime Start = GpsTime.FromSeconds(1_000_000_000m);
    private static readonly double[] Freqs = [13.7, 41.3, 87.1, 150.9];

    // Invented stage: a resonant pair at 30 +- 40i Hz, a real pole at 200 Hz, a zero at 5 Hz, 1.26-sample delay.
    private static readonly ChainStageModel Stage = new(
        [new Complex(-5, 0)],
        [new Complex(-30, 40), new Complex(-30, -40), new Complex(-200, 0)],
        Gain: 5e5,
        DelaySeconds: 1.26 / Fs);

    [Fact]
    public void Stage_discretisation_reproduces_the_bilinear_check_values()
    {
        // H(s) = wc / (s + wc), wc = 2 pi 10 rad/s: pole at -10 Hz, gain wc; prewarpHz 0 = no pre-warp.
        var model = new ChainStageModel([], [new Complex(-10, 0)], 2 * Math.PI * 10, 0, PrewarpHz: 0);
        var d = DataChainCheck.Discretise(model, 100);
        // ref (scipy.signal.bilinear_zpk), CHECKS.md bilinear row
        Assert.Equal(-1.0, Assert.Single(d.Zeros).Real, 12);
        Assert.Equal(0.521885552779, Assert.Single(d.Poles).Real, 12);
        Assert.Equal(0.239057223611, d.Gain, 12);
        Assert.Equal(0.6951024153, FrequencyResponse.Magnitude(d, 10, 100), 10);

        // Default pre-warp: the geometric mean of the root magnitudes, 10 Hz, where the digital response equals the analogue 1/sqrt(2).
        var warped = model with { PrewarpHz = null };
        Assert.Equal(10, warped.EffectivePrewarpHz(100)!.Value, 12);
        Assert.Equal(1 / Math.Sqrt(2), FrequencyResponse.Magnitude(DataChainCheck.Discretise(warped, 100), 10, 100), 12);
    }

    [Fact]
    public void A_simulated_stage_with_nothing_added_is_noise_and_its_model_fits()
    {
        var (input, output, _) = Simulate(seed: 11, burstAmplitudeSigma: 0);
        var report = DataChainCheck.Run(input, [output], [Stage with { ExpectedNoiseRms = NoiseSigma }], Start.AddSeconds(10));
        var s = Assert.Single(report.Stages);
        Assert.False(s.Added);
        Assert.True(s.ModelFits);
        Assert.Equal(Verdict.ResidualIsNoise, s.Judgement.Verdict);
        Assert.Equal("residual is noise", report.Judgement.Word);
        Assert.True(s.MaxExcessSigma < s.ThresholdSigma);
        // Residual is the measurement noise: robust sigma and off-source RMS within 5 % of it (statistical).
        Assert.Equal(1.0, s.RobustSigma / NoiseSigma, 0.05);
        Assert.Equal(1.0, s.NoiseRatio!.Value, 0.05);
        Assert.Equal(1.0, s.ResidualRms / s.OffSourceRms, 0.2);
        Assert.InRange(s.CoherentFraction, 0, 0.2);
        Assert.True(s.SkippedStartSeconds > 0.1 && s.SkippedStartSeconds < 1);
        // Only the on-source window is tested: +-1 s at 1024 Hz.
        Assert.Equal(2049, s.SamplesTested);
        Assert.Equal(N - (2 * (int)Math.Round(s.SkippedStartSeconds * Fs)) - 2049, s.OffSourceSamples);
        Assert.Empty(s.OutsideWindow);
    }

    [Fact]
    public void The_threshold_is_the_trials_corrected_two_sided_normal_quantile()
    {
        // One sample at 2 Q(3) = 2.69979606326e-3: z = 3 (Q(3) = 1.34989803163e-3, Abramowitz & Stegun table 26.1, from memory).
        Assert.Equal(3.0, ChainStageCheck.Threshold(2.69979606326e-3, 1), 1e-9);

        // n samples: 1 - (1 - 2 Q(z))^n = P (identity), and z grows with n.
        foreach (var n in new[] { 10, 2049, 1_000_000 })
        {
            var z = ChainStageCheck.Threshold(1e-3, n);
            var perSample = 2 * EventReview.Core.Statistics.GaussianTail.Q(z);
            Assert.Equal(1.0, (1 - Math.Pow(1 - perSample, n)) / 1e-3, 1e-6); // double rounding of 1 - 1e-9 limits the digits
        }

        Assert.True(ChainStageCheck.Threshold(1e-3, 1_000_000) > ChainStageCheck.Threshold(1e-3, 2049));
    }

    [Fact]
    public void A_small_added_chirp_inside_the_window_is_an_excess_at_the_right_time()
    {
        var (input, output, burstGps) = Simulate(seed: 11, burstAmplitudeSigma: 12);
        var report = DataChainCheck.Run(input, [output], [Stage], Start.AddSeconds(10), new DataChainOptions(WindowSeconds: 0.5));
        var s = Assert.Single(report.Stages);
        Assert.True(s.Added);
        Assert.True(s.ModelFits);
        Assert.Equal(Verdict.ExcessFound, s.Judgement.Verdict);
        Assert.Equal("excess found", report.Judgement.Word);
        Assert.InRange(s.MaxExcessSigma, 8, 14);
        Assert.InRange(s.MaxExcessGps, burstGps - 0.05, burstGps + 0.05);
        Assert.True(s.ResidualRms > 1.5 * s.OffSourceRms);
    }

    [Fact]
    public void An_excursion_outside_the_window_is_listed_but_never_sets_the_candidate_verdict()
    {
        // The same 12-sigma burst at +10.2 s, but the candidate sits at +14 s. The old statistic searched the whole record
        // and would have reported an addition at the candidate; only the on-source window may decide.
        var (input, output, burstGps) = Simulate(seed: 11, burstAmplitudeSigma: 12);
        var report = DataChainCheck.Run(input, [output], [Stage], Start.AddSeconds(14));
        var s = Assert.Single(report.Stages);
        var wholeRecordMax = Math.Max(s.MaxExcessSigma, s.OutsideWindow.Max(e => e.Sigma));
        Assert.True(wholeRecordMax > 5, "the old whole-record statistic would have flagged this record");
        Assert.False(s.Added);
        Assert.Equal(Verdict.ResidualIsNoise, report.Judgement.Verdict);
        var e = s.OutsideWindow[0];
        Assert.InRange(e.Gps, burstGps - 0.05, burstGps + 0.05);
        Assert.Equal(e.Gps - (Start.Seconds + 14), e.OffsetSeconds, 1e-9);
        Assert.True(e.Sigma > s.OutsideThresholdSigma);
        Assert.Equal(s.OutsideWindow.Count, s.OutsideWindowCount);
    }

    [Fact]
    public void A_stage_model_twenty_percent_off_in_gain_does_not_fit_while_the_old_statistic_passed_it()
    {
        var (input, output, _) = Simulate(seed: 11, burstAmplitudeSigma: 0);
        var wrong = Stage with { Gain = Stage.Gain * 1.2 };
        var report = DataChainCheck.Run(input, [output], [wrong], Start.AddSeconds(10));
        var s = Assert.Single(report.Stages);

        // The old statistic judged the residual only against its own scatter: its largest excursion anywhere stays
        // below 5 robust sigma, so it passed the stage as clean with a model that does not describe it.
        Assert.True(Math.Max(s.MaxExcessSigma, s.OutsideWindow.Select(e => e.Sigma).DefaultIfEmpty(0).Max()) < 5);
        Assert.False(s.ModelFits);
        Assert.True(s.CoherentFraction > 0.9, $"coherent fraction {s.CoherentFraction}");
        Assert.True(s.ResidualToOutputPower > 1e-2);
        Assert.Equal(Verdict.ModelDoesNotFit, report.Judgement.Verdict);
        Assert.Contains("does not fit", report.Judgement.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void A_residual_well_above_the_stated_expected_noise_means_the_model_does_not_fit()
    {
        var (input, output, _) = Simulate(seed: 11, burstAmplitudeSigma: 0);
        var fits = DataChainCheck.Run(input, [output], [Stage with { ExpectedNoiseRms = NoiseSigma }], Start.AddSeconds(10)).Stages[0];
        var tooQuiet = DataChainCheck.Run(input, [output], [Stage with { ExpectedNoiseRms = NoiseSigma / 3 }], Start.AddSeconds(10)).Stages[0];
        Assert.True(fits.ModelFits);
        Assert.False(tooQuiet.ModelFits);
        Assert.Equal(3.0, tooQuiet.NoiseRatio!.Value, 0.15);
        Assert.Equal(Verdict.ModelDoesNotFit, tooQuiet.Judgement.Verdict);
    }

    [Fact]
    public void Over_1000_clean_records_the_false_alarm_rate_is_within_the_stated_probability()
    {
        // Short records: 8 s at 256 Hz, white input through a one-pole low-pass, white measurement noise on the output.
        const double fs = 256;
        const int n = 2048;
        const double stated = 0.05;
        var model = new ChainStageModel([], [new Complex(-20, 0)], 2 * Math.PI * 20);
        var sos = SecondOrderSections.FromZpk(DataChainCheck.Discretise(model, fs));
        var random = new Random(20261205);
        int excess = 0, misfit = 0;
        for (var r = 0; r < 1000; r++)
        {
            var x = new double[n];
            for (var i = 0; i < n; i++)
            {
                x[i] = Gauss(random);
            }

            var y = SosFilter.Apply(sos, x);
            for (var i = 0; i < n; i++)
            {
                y[i] += 0.01 * Gauss(random);
            }

            var report = DataChainCheck.Run(new TimeSeries(Start, fs, x), [new TimeSeries(Start, fs, y)], [model], Start.AddSeconds(4),
                new DataChainOptions(WindowSeconds: 1, FalseAlarmProbability: stated));
            excess += report.Stages[0].Added ? 1 : 0;
            misfit += report.Stages[0].ModelFits ? 0 : 1;
        }

        // Binomial(1000, 0.05): mean 50, sd 6.9; the rate must not exceed the stated probability beyond 3 sd, and the
        // threshold must not be so loose that it never fires (then it would state a probability it does not have).
        Assert.InRange(excess, 25, 71);
        Assert.Equal(0, misfit);
    }

    [Fact]
    public void Stage_pictures_are_well_formed_plot_svgs_with_the_residual_its_spectrum_and_the_verdict_in_the_caption()
    {
        var (input, output, _) = Simulate(seed: 11, burstAmplitudeSigma: 12);
        var (report, traces) = DataChainCheck.RunWithTraces(input, [output], [Stage], Start.AddSeconds(10));
        var svg = PlotSvg.Write(ChainResidualFigure.Build(traces[0], report.Stages[0], report.CenterGps, report.WindowSeconds));
        var drawing = PlotSvg.Read(svg);
        Assert.NotNull(drawing);
        Assert.Contains("excess found", drawing.Caption);
        var spectrum = PlotSvg.Read(PlotSvg.Write(ChainSpectrumFigure.Build(traces[0], report.Stages[0])));
        Assert.NotNull(spectrum);
        Assert.Contains("spectrum", spectrum.Caption);
        Assert.Equal(N, traces[0].Residual.Length);
    }

    [Fact]
    public void Residual_figure_zooms_on_the_candidate_against_the_threshold_band_in_robust_sigma()
    {
        var (input, output, _) = Simulate(seed: 11, burstAmplitudeSigma: 12);
        var (report, traces) = DataChainCheck.RunWithTraces(input, [output], [Stage], Start.AddSeconds(10));
        var stage = report.Stages[0];
        var fig = ChainResidualFigure.Build(traces[0], stage, report.CenterGps, report.WindowSeconds);

        var band = fig.Elements.OfType<PlotBand>().Single(b => b.Label!.Contains("threshold", StringComparison.Ordinal));
        Assert.Equal(-stage.ThresholdSigma, band.Lower[0], 12);
        Assert.Equal(stage.ThresholdSigma, band.Upper[0], 12);
        Assert.InRange(fig.X.Min, -4 * report.WindowSeconds - 0.01, 0);
        Assert.InRange(fig.X.Max, 0, 4 * report.WindowSeconds + 0.01);
        var residual = fig.Elements.OfType<PlotLine>().Single(l => l.Label!.StartsWith("residual", StringComparison.Ordinal));
        Assert.True(residual.Ys.Max(Math.Abs) > stage.ThresholdSigma, "a 12 sigma burst must leave the band on the picture");
        Assert.Contains("σ", fig.Y.Label);
        Assert.True(fig.Y.Max >= stage.ThresholdSigma, "the band must be inside the drawn range");
    }

    [Fact]
    public void Residual_figure_of_a_quiet_stage_keeps_the_band_in_view_rather_than_autoscaling_to_the_noise()
    {
        // Adversarial: scaled to its own noise, a quiet residual fills the panel and looks as alarming as a loud one.
        var (input, output, _) = Simulate(seed: 3, burstAmplitudeSigma: 0);
        var (report, traces) = DataChainCheck.RunWithTraces(input, [output], [Stage], Start.AddSeconds(10));
        var fig = ChainResidualFigure.Build(traces[0], report.Stages[0], report.CenterGps, report.WindowSeconds);
        Assert.True(fig.Y.Max >= 1.25 * report.Stages[0].ThresholdSigma);
    }

    [Fact]
    public void In_a_chain_only_the_stage_that_added_something_is_flagged()
    {
        var (input, output1, _) = Simulate(seed: 3, burstAmplitudeSigma: 0);
        var stage2 = new ChainStageModel([], [new Complex(-100, 0)], 2 * Math.PI * 100, DelaySeconds: 3 / Fs);
        var d2 = SecondOrderSections.FromZpk(DataChainCheck.Discretise(stage2, Fs));
        var filtered = SosFilter.Apply(d2, output1.Samples);
        var random = new Random(5);
        var y2 = new double[N];
        for (var i = 0; i < N; i++)
        {
            var t = i / Fs;
            y2[i] = (i >= 3 ? filtered[i - 3] : 0) + (1e-4 * Gauss(random)) + (2e-3 * Chirp(t - 12.0));
        }

        var report = DataChainCheck.Run(input, [output1, new TimeSeries(Start, Fs, y2)], [Stage, stage2], Start.AddSeconds(12));
        Assert.Equal(2, report.Stages.Count);
        Assert.False(report.Stages[0].Added);
        Assert.True(report.Stages[1].Added);
        Assert.True(report.Stages[1].ModelFits);
        Assert.InRange(report.Stages[1].MaxExcessGps, Start.Seconds + 11.95, Start.Seconds + 12.05);
        Assert.Equal("excess found", report.Judgement.Word);
    }

    [Fact]
    public void Model_file_with_an_unstable_pole_is_rejected_with_a_clear_message()
    {
        const string json = """{"stages": [{"zerosHz": [], "polesHz": [[-10, 0]], "gain": 1}, {"polesHz": [[0.5, 3], [0.5, -3]], "gain": 2}]}""";
        var ex = Assert.Throws<FormatException>(() => ChainModelJson.Parse(json));
        Assert.Contains("stage 2: pole 1", ex.Message);
        Assert.Contains("unstable", ex.Message);
        Assert.Throws<FormatException>(() => ChainModelJson.Parse("""{"stages": [{"polesHz": [[-1, 2]], "gain": 1}]}""")); // unpaired
        Assert.Throws<FormatException>(() => ChainModelJson.Parse("""{"stages": [{"polesHz": [[-1]], "gain": 1}]}"""));
        Assert.Throws<FormatException>(() => ChainModelJson.Parse("""{"stages": [{"polesHz": [[-1, 0]]}]}"""));
        Assert.Throws<FormatException>(() => ChainModelJson.Parse("not json"));
    }

    [Fact]
    public void Model_file_reads_roots_gain_delay_and_prewarp()
    {
        const string json = """{"stages": [{"zerosHz": [[-5, 0]], "polesHz": [[-30, 40], [-30, -40]], "gain": 3.5, "delaySeconds": 0.001, "prewarpHz": 50}]}""";
        var s = Assert.Single(ChainModelJson.Parse(json));
        Assert.Equal(new Complex(-30, -40), s.PolesHz[1]);
        Assert.Equal(3.5, s.Gain);
        Assert.Equal(0.001, s.DelaySeconds);
        Assert.Equal(50, s.PrewarpHz);
        Assert.Null(s.ExpectedNoiseRms);
        var noisy = Assert.Single(ChainModelJson.Parse("""{"stages": [{"polesHz": [[-3, 0]], "gain": 1, "expectedNoiseRms": 2.9e-5}]}"""));
        Assert.Equal(2.9e-5, noisy.ExpectedNoiseRms);
        Assert.Throws<FormatException>(() => ChainModelJson.Parse("""{"stages": [{"polesHz": [[-3, 0]], "gain": 1, "expectedNoiseRms": -1}]}"""));
    }

    [Fact]
    public void Fractional_delay_shifts_a_slow_sine_by_the_right_time()
    {
        var x = Enumerable.Range(0, 512).Select(i => Math.Sin(2 * Math.PI * 0.05 * i)).ToArray();
        var y = FractionalDelay.Apply(x, 2.3);
        for (var i = 40; i < 470; i++)
        {
            Assert.Equal(Math.Sin(2 * Math.PI * 0.05 * (i - 2.3)), y[i], 1e-4); // identity: y[n] = x(n - d)
        }
    }

    private static void FigureChecks(PlotFigure fig) => EventReview.Core.Tests.Plots.Figures.FigureBackEndTests.AssertDrawable(fig);

    private const double NoiseSigma = 1e-3;

    // Recorded output = exact steady-state response of the digital stage to each input sine (|H| and arg H from the
    // ZPK, the delay as a phase), computed independently of the filtering code, plus white measurement noise.
    private static (TimeSeries Input, TimeSeries Output, double BurstGps) Simulate(int seed, double burstAmplitudeSigma)
    {
        var digital = DataChainCheck.Discretise(Stage, Fs);
        var scale = Freqs.Select(f => FrequencyResponse.Digital(digital, f, Fs).Magnitude).Max();
        var random = new Random(seed);
        var x = new double[N];
        var y = new double[N];
        const double burstAt = 10.2;
        for (var i = 0; i < N; i++)
        {
            var t = i / Fs;
            foreach (var f in Freqs)
            {
                var h = FrequencyResponse.Digital(digital, f, Fs) / scale;
                x[i] += Math.Sin(2 * Math.PI * f * t) / scale;
                y[i] += h.Magnitude * Math.Sin((2 * Math.PI * f * (t - Stage.DelaySeconds)) + h.Phase);
            }

            y[i] += (NoiseSigma * Gauss(random)) + (burstAmplitudeSigma * NoiseSigma * Chirp(t - burstAt));
        }

        return (new TimeSeries(Start, Fs, x), new TimeSeries(Start, Fs, y), Start.Seconds + burstAt);
    }

    // Chirp-like burst: 60 Hz rising at 400 Hz/s under a Gaussian envelope of 40 ms, unit peak.
    private static double Chirp(double t) => Math.Exp(-(t * t) / (2 * 0.04 * 0.04)) * Math.Cos(2 * Math.PI * ((60 * t) + (200 * t * t)));

    private static double Gauss(Random r) => Math.Sqrt(-2 * Math.Log(1 - r.NextDouble())) * Math.Cos(2 * Math.PI * r.NextDouble());
}
