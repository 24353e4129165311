using System.Globalization;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Filters;
using EventReview.Core.Time;

namespace EventReview.Core.Chain;

/// <summary>
/// Data-chain check: could something have been added between the input and the output of a stage? Predicts each
/// stage's output from its recorded input with the stage model (ZPK in Hz, bilinear transform, pure delay), subtracts it
/// from the recorded output and judges the residual against its own off-source scatter. For a chain, stage k's input is
/// stage k-1's recorded output.
/// </summary>
public static class DataChainCheck
{
    /// <summary>Runs the check; see <see cref="RunWithTraces"/>.</summary>
    public static DataChainReport Run(TimeSeries input, IReadOnlyList<TimeSeries> outputs, IReadOnlyList<ChainStageModel> stages, GpsTime center, DataChainOptions? options = null) =>
        RunWithTraces(input, outputs, stages, center, options).Report;

    /// <summary>
    /// Runs the check and also returns the per-stage traces. Each stage: align input and output on their common span
    /// (same sample rate, whole-sample offset), filter the input from rest with the discretised model, delay it, take
    /// residual = recorded - predicted, skip the settling time (slowest digital pole decaying by <see cref="DataChainOptions.SettlingDecay"/>,
    /// plus the delay and the interpolator length) at both ends, then compute RMS on-source (|t - center| &lt;= W) and off-source,
    /// the robust sigma 1.4826 x MAD of the off-source residual, and the largest excursion from the off-source median in sigma.
    /// </summary>
    /// <exception cref="ArgumentException">Mismatched counts, sample rates or spans, an invalid stage model, or too little data
    /// left after the settling skip; the message names the stage.</exception>
    public static (DataChainReport Report, IReadOnlyList<ChainStageTrace> Traces) RunWithTraces(
        TimeSeries input, IReadOnlyList<TimeSeries> outputs, IReadOnlyList<ChainStageModel> stages, GpsTime center, DataChainOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(outputs);
        ArgumentNullException.ThrowIfNull(stages);
        options ??= new DataChainOptions();
        if (!(options.WindowSeconds > 0) || !(options.SigmaThreshold > 0) || !(options.SettlingDecay is > 0 and < 1))
        {
            throw new ArgumentOutOfRangeException(nameof(options), options, "WindowSeconds and SigmaThreshold must be > 0 and SettlingDecay in (0, 1).");
        }

        if (outputs.Count == 0 || outputs.Count != stages.Count)
        {
            throw new ArgumentException($"{outputs.Count} recorded outputs for {stages.Count} stage models: give one output per stage, in order", nameof(outputs));
        }

        var results = new List<ChainStageResult>();
        var traces = new List<ChainStageTrace>();
        var stageInput = input;
        for (var k = 0; k < stages.Count; k++)
        {
            stages[k].Validate(k + 1);
            var (result, trace) = RunStage(k + 1, stageInput, outputs[k], stages[k], center, options);
            results.Add(result);
            traces.Add(trace);
            stageInput = outputs[k];
        }

        var assumptions = new List<string>
        {
            "stage model: H(s) = gain x prod(s - 2 pi z) / prod(s - 2 pi p), roots in Hz, discretised by the bilinear transform pre-warped at prewarpHz (default: geometric mean of the non-zero root magnitudes)",
            "the predicted output starts from rest; the settling time (slowest digital pole decaying by " + options.SettlingDecay.ToString("G3", CultureInfo.InvariantCulture) + "), the delay and the interpolator length are skipped at both ends",
            "fractional delays by a Hann-windowed sinc interpolator of 64 taps (integer part shifted exactly)",
            "robust sigma = 1.4826 x median absolute deviation of the off-source residual, floored at 1e-12 x output RMS (round-off)",
            string.Create(CultureInfo.InvariantCulture, $"on-source window +-{options.WindowSeconds} s around the candidate; 'something added' when the largest excursion exceeds {options.SigmaThreshold} sigma"),
            "for a chain, each stage's input is the previous stage's recorded output",
            "the threshold applies to every tested sample, so Gaussian noise alone crosses it with the probability given per stage (trials factor)",
        };
        var verdict = results.Any(r => r.Added) ? "something added" : "nothing added";
        return (new DataChainReport(results, center.Seconds, options.WindowSeconds, options.SigmaThreshold, verdict, assumptions), traces);
    }

    /// <summary>Discretises a stage model at a sample rate (bilinear transform, pre-warped as the model says).</summary>
    public static Zpk Discretise(ChainStageModel model, double sampleRateHz)
    {
        ArgumentNullException.ThrowIfNull(model);
        return Bilinear.Transform(model.ToAnalog(), sampleRateHz, model.EffectivePrewarpHz(sampleRateHz));
    }

    private static (ChainStageResult, ChainStageTrace) RunStage(int stage, TimeSeries x, TimeSeries y, ChainStageModel model, GpsTime center, DataChainOptions options)
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

        var recorded = y.Samples.AsSpan(y0, n).ToArray();
        var digital = Discretise(model, fs);
        var filtered = SosFilter.Apply(SecondOrderSections.FromZpk(digital), x.Samples.AsSpan(x0, n));
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
        var on = new List<double>();
        var off = new List<double>();
        for (var i = first; i <= last; i++)
        {
            (Math.Abs(i - centerIndex) <= half ? on : off).Add(residual[i]);
        }

        if (on.Count == 0)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"stage {stage}: the candidate window has no usable sample (record {start} + {n / fs:G6} s, {skip / fs:G4} s skipped at each end for settling)"), nameof(center));
        }

        if (off.Count < 16)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"stage {stage}: only {off.Count} off-source samples after skipping {skip / fs:G4} s of settling at each end; give a longer record"), nameof(x));
        }

        var median = Median(off);
        var mad = Median(off.Select(v => Math.Abs(v - median)).ToList());
        var outputRms = Rms(recorded.AsSpan(first, last - first + 1).ToArray());
        var sigma = Math.Max(1.4826 * mad, 1e-12 * outputRms); // MAD to sigma for a normal distribution (Rousseeuw and Croux 1993)
        var best = first;
        for (var i = first; i <= last; i++)
        {
            if (Math.Abs(residual[i] - median) > Math.Abs(residual[best] - median))
            {
                best = i;
            }
        }

        var excess = sigma > 0 ? Math.Abs(residual[best] - median) / sigma : 0;
        var added = excess > options.SigmaThreshold;
        var tested = last - first + 1;
        var perSample = MathNet.Numerics.SpecialFunctions.Erfc(options.SigmaThreshold / Math.Sqrt(2)); // two-sided normal tail 2 Q(N)
        var falseAlarm = -Statistics.ExpMinusOne.Of(tested * Math.Log(1 - perSample));
        var result = new ChainStageResult(stage, Rms(on), Rms(off), sigma, excess, start.AddSeconds(best / fs).Seconds, added,
            skip / fs, skip / fs, model.EffectivePrewarpHz(fs), model.DelaySeconds, added ? "something added" : "nothing added", tested, falseAlarm);
        var trace = new ChainStageTrace(stage, start.Seconds, fs, recorded, predicted, residual, first, last);
        return (result, trace);
    }


    private static double Rms(IReadOnlyCollection<double> v) => v.Count == 0 ? double.NaN : Math.Sqrt(v.Sum(a => a * a) / v.Count);

    private static double Median(List<double> v)
    {
        var s = v.Order().ToArray();
        return s.Length % 2 == 1 ? s[s.Length / 2] : 0.5 * (s[(s.Length / 2) - 1] + s[s.Length / 2]);
    }
}
