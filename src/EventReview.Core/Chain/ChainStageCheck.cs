using System.Globalization;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Filters;
using EventReview.Core.Statistics;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;
using EventReview.Core.Formatting;

namespace EventReview.Core.Chain;

/// <summary>One stage of <see cref="DataChainCheck"/>: prediction, residual, on-source test, outside excursions, model fit, verdict.</summary>
internal static class ChainStageCheck
{
    private const int OutsideKept = 20;
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static (ChainStageResult, ChainStageTrace) Run(int stage, TimeSeries x, TimeSeries y, ChainStageModel model, GpsTime center, DataChainOptions options)
    {
        var fs = x.SampleRateHz;
        if (Math.Abs(y.SampleRateHz - fs) > 1e-9 * fs)
        {
            throw new ArgumentException($"stage {stage}: input at {fs} Hz but output at {y.SampleRateHz} Hz; resample first", nameof(y));
        }

        var offset = y.Start.SecondsSince(x.Start) * fs;
        if (Math.Abs(offset - Math.Round(offset)) > 1e-3)
        {
            throw new ArgumentException($"stage {stage}: output samples are not aligned with input samples (offset {offset:G6} samples)", nameof(y));
        }

        var shift = (long)Math.Round(offset);
        var x0 = (int)Math.Max(0, shift);
        var y0 = (int)Math.Max(0, -shift);
        var n = Math.Min(x.Length - x0, y.Length - y0);
        if (n < 32)
        {
            throw new ArgumentException($"stage {stage}: input and output overlap by only {Math.Max(n, 0)} samples", nameof(y));
        }

        var inputPart = x.Samples.AsSpan(x0, n).ToArray();
        var recorded = y.Samples.AsSpan(y0, n).ToArray();
        var digital = DataChainCheck.Discretise(model, fs);
        var filtered = SosFilter.Apply(SecondOrderSections.FromZpk(digital), inputPart);
        var delaySamples = model.DelaySeconds * fs;
        var predicted = FractionalDelay.Apply(filtered, delaySamples);
        var residual = new double[n];
        for (var i = 0; i < n; i++)
        {
            residual[i] = recorded[i] - predicted[i];
        }

        var maxPole = digital.Poles.Count == 0 ? 0 : digital.Poles.Max(p => p.Magnitude);
        var settle = maxPole > 0 ? (int)Math.Ceiling(Math.Log(options.SettlingDecay) / Math.Log(maxPole)) : 0;
        var skip = settle + (int)Math.Ceiling(Math.Abs(delaySamples)) + FractionalDelay.HalfLength + 1;
        var first = skip;
        var last = n - 1 - skip;
        var start = x.TimeOf(x0);
        var centerIndex = center.SecondsSince(start) * fs;
        var half = options.WindowSeconds * fs;
        bool OnSource(int i) => Math.Abs(i - centerIndex) <= half;
        var on = new List<double>();
        var off = new List<double>();
        for (var i = first; i <= last; i++)
        {
            (OnSource(i) ? on : off).Add(residual[i]);
        }

        if (on.Count == 0)
        {
            throw new ArgumentException(string.Create(Inv,
                $"stage {stage}: the candidate window has no usable sample (record {start} + {n / fs:G6} s, {skip / fs:G4} s skipped at each end for settling)"), nameof(center));
        }

        if (off.Count < 16)
        {
            throw new ArgumentException(string.Create(Inv,
                $"stage {stage}: only {off.Count} off-source samples after skipping {skip / fs:G4} s of settling at each end; give a longer record"), nameof(x));
        }

        var tested = last - first + 1;
        var (fraction, maxCoherence, segments) = ChainCoherence.Estimate(inputPart, residual, first, tested);
        if (segments < ChainCoherence.MinSegments)
        {
            throw new ArgumentException(string.Create(Inv,
                $"stage {stage}: only {tested} samples after settling, too few to test whether the model fits (coherence needs {ChainCoherence.MinSegments} segments); give a longer record"), nameof(x));
        }

        var median = Median(off);
        var mad = Median(off.Select(v => Math.Abs(v - median)).ToList());
        var outputRms = Rms(recorded.AsSpan(first, tested).ToArray());
        var sigma = Math.Max(1.4826 * mad, 1e-12 * outputRms); // MAD to sigma for a normal distribution (Rousseeuw and Croux 1993)
        double Z(int i) => sigma > 0 ? Math.Abs(residual[i] - median) / sigma : 0;

        var threshold = Threshold(options.FalseAlarmProbability, on.Count);
        var outsideThreshold = Threshold(options.FalseAlarmProbability, off.Count);
        var best = -1;
        for (var i = first; i <= last; i++)
        {
            if (OnSource(i) && (best < 0 || Z(i) > Z(best)))
            {
                best = i;
            }
        }

        var excursions = Outside(first, last, OnSource, Z, outsideThreshold, fs, start, center);
        var offRms = Rms(off);
        double? noiseRatio = model.ExpectedNoiseRms is { } expected ? offRms / expected : null;
        var residualPower = Sum2(residual, first, tested) / Math.Max(Sum2(recorded, first, tested), 1e-300);
        var modelFits = fraction < options.CoherentFractionLimit && !(noiseRatio > options.NoiseRatioLimit);
        var result = new ChainStageResult
        {
            Stage = stage,
            ResidualRms = Rms(on),
            OffSourceRms = offRms,
            RobustSigma = sigma,
            MaxExcessSigma = Z(best),
            MaxExcessGps = start.AddSeconds(best / fs).Seconds,
            Added = Z(best) > threshold,
            ThresholdSigma = threshold,
            FalseAlarmProbability = options.FalseAlarmProbability,
            SamplesTested = on.Count,
            OutsideWindow = [.. excursions.Take(OutsideKept)],
            OutsideWindowCount = excursions.Count,
            OutsideThresholdSigma = outsideThreshold,
            OffSourceSamples = off.Count,
            ExpectedNoiseRms = model.ExpectedNoiseRms,
            NoiseRatio = noiseRatio,
            ResidualToOutputPower = residualPower,
            CoherentFraction = fraction,
            MaxCoherence = maxCoherence,
            CoherenceSegments = segments,
            ModelFits = modelFits,
            SkippedStartSeconds = skip / fs,
            SkippedEndSeconds = skip / fs,
            PrewarpHz = model.EffectivePrewarpHz(fs),
            DelaySeconds = model.DelaySeconds,
            Judgement = new Judgement(Verdict.NotRun, string.Empty),
        };
        result = result with { Judgement = Judge(result, center, options) };
        var trace = new ChainStageTrace(stage, start.Seconds, fs, recorded, predicted, residual, first, last);
        return (result, trace);
    }

    /// <summary>z with 2 Q(z) = 1 - (1 - p)^(1/n): per-sample two-sided threshold for a false-alarm probability p over n samples.</summary>
    public static double Threshold(double p, int n)
    {
        var perSample = -ExpMinusOne.Of(Math.Log(1 - p) / n);
        return GaussianTail.InverseQ(perSample / 2);
    }

    private static Judgement Judge(ChainStageResult s, GpsTime center, DataChainOptions o)
    {
        var excess = string.Create(Inv,
            $"largest on-source excursion {s.MaxExcessSigma:0.00}σ at {s.MaxExcessGps - center.Seconds:+0.000;-0.000} s against the {s.ThresholdSigma:0.00}σ threshold (false-alarm probability {s.FalseAlarmProbability:G3} over {s.SamplesTested:N0} on-source samples)");
        var fit = string.Create(Inv, $"coherent fraction with the input {s.CoherentFraction:P0} (limit {o.CoherentFractionLimit:P0}), residual power {ScientificFormat.Format(s.ResidualToOutputPower, 3)} of the output's")
            + (s.NoiseRatio is { } r ? string.Create(Inv, $", off-source residual RMS {r:0.##} × the expected noise (limit {o.NoiseRatioLimit:0.##})") : ", no expected noise stated");
        if (!s.ModelFits)
        {
            return new Judgement(Verdict.ModelDoesNotFit,
                $"stage {s.Stage}: the model does not fit, so an addition can be neither ruled out nor confirmed until it is corrected: {fit}; {excess}");
        }

        return s.Added
            ? new Judgement(Verdict.ExcessFound, $"stage {s.Stage}: excess found, {excess}; the model fits ({fit})")
            : new Judgement(Verdict.ResidualIsNoise, $"stage {s.Stage}: residual is noise, {excess}; the model fits ({fit})");
    }

    private static List<ChainExcursion> Outside(int first, int last, Func<int, bool> onSource, Func<int, double> z, double threshold, double fs, GpsTime start, GpsTime center)
    {
        var gap = Math.Max(1, (int)Math.Round(0.01 * fs));
        var list = new List<ChainExcursion>();
        int? peak = null;
        var count = 0;
        var lastAbove = int.MinValue;
        for (var i = first; i <= last + gap + 1; i++)
        {
            var above = i <= last && !onSource(i) && z(i) > threshold;
            if (peak is { } p && (i - lastAbove > gap || i > last))
            {
                var t = start.AddSeconds(p / fs);
                list.Add(new ChainExcursion(t.Seconds, t.SecondsSince(center), z(p), count));
                peak = null;
                count = 0;
            }

            if (above)
            {
                peak = peak is { } q && z(q) >= z(i) ? q : i;
                count++;
                lastAbove = i;
            }
        }

        return [.. list.OrderByDescending(e => e.Sigma)];
    }

    private static double Sum2(double[] v, int from, int count)
    {
        var s = 0.0;
        for (var i = from; i < from + count; i++)
        {
            s += v[i] * v[i];
        }

        return s;
    }

    private static double Rms(IReadOnlyCollection<double> v) => v.Count == 0 ? double.NaN : Math.Sqrt(v.Sum(a => a * a) / v.Count);

    private static double Median(List<double> v)
    {
        var s = v.Order().ToArray();
        return s.Length % 2 == 1 ? s[s.Length / 2] : 0.5 * (s[(s.Length / 2) - 1] + s[s.Length / 2]);
    }
}
