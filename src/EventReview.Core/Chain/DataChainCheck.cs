using System.Globalization;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Filters;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Chain;

/// <summary>
/// Data-chain check: could something have been added between the input and the output of a stage? Predicts each
/// stage's output from its recorded input with the stage model (ZPK in Hz, bilinear transform, pure delay), subtracts it
/// from the recorded output and judges the residual: inside the on-source window against a threshold set from a stated
/// false-alarm probability, outside it only listed; and whether the model fits at all (residual coherent with the input,
/// or above the stage's expected noise). For a chain, stage k's input is stage k-1's recorded output.
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
    /// plus the delay and the interpolator length) at both ends. The robust sigma is 1.4826 x MAD of the off-source residual
    /// (|t - center| &gt; W). The largest excursion from the off-source median is searched only on-source (|t - center| &lt;= W)
    /// against z with 2 Q(z) = 1 - (1 - P)^(1/n), n the on-source samples (trials-corrected); off-source excursions above the
    /// same rule for the off-source samples are listed. The model fits unless the residual's coherent fraction with the input
    /// reaches <see cref="DataChainOptions.CoherentFractionLimit"/> or its off-source RMS exceeds the stated expected noise by
    /// more than <see cref="DataChainOptions.NoiseRatioLimit"/>.
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
        if (!(options.WindowSeconds > 0) || !(options.FalseAlarmProbability is > 0 and < 1) || !(options.SettlingDecay is > 0 and < 1)
            || !(options.CoherentFractionLimit is > 0 and <= 1) || !(options.NoiseRatioLimit > 1))
        {
            throw new ArgumentOutOfRangeException(nameof(options), options,
                "WindowSeconds must be > 0, FalseAlarmProbability and SettlingDecay in (0, 1), CoherentFractionLimit in (0, 1] and NoiseRatioLimit > 1.");
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
            var (result, trace) = ChainStageCheck.Run(k + 1, stageInput, outputs[k], stages[k], center, options);
            results.Add(result);
            traces.Add(trace);
            stageInput = outputs[k];
        }

        return (new DataChainReport(results, center.Seconds, options.WindowSeconds, options.FalseAlarmProbability, Overall(results), Assumptions(options)), traces);
    }

    /// <summary>Discretises a stage model at a sample rate (bilinear transform, pre-warped as the model says).</summary>
    public static Zpk Discretise(ChainStageModel model, double sampleRateHz)
    {
        ArgumentNullException.ThrowIfNull(model);
        return Bilinear.Transform(model.ToAnalog(), sampleRateHz, model.EffectivePrewarpHz(sampleRateHz));
    }

    private static Judgement Overall(List<ChainStageResult> stages)
    {
        var excess = stages.Where(s => s.Judgement.Verdict == Verdict.ExcessFound).ToList();
        if (excess.Count > 0)
        {
            return new Judgement(Verdict.ExcessFound, string.Join(" | ", excess.Select(s => s.Judgement.Reason)));
        }

        var misfit = stages.Where(s => !s.ModelFits).ToList();
        if (misfit.Count > 0)
        {
            return new Judgement(Verdict.ModelDoesNotFit, string.Join(" | ", misfit.Select(s => s.Judgement.Reason)));
        }

        return new Judgement(Verdict.ResidualIsNoise, string.Join(" | ", stages.Select(s => s.Judgement.Reason)));
    }

    private static List<string> Assumptions(DataChainOptions o)
    {
        var inv = CultureInfo.InvariantCulture;
        return
        [
            "stage model: H(s) = gain x prod(s - 2 pi z) / prod(s - 2 pi p), roots in Hz, discretised by the bilinear transform pre-warped at prewarpHz (default: geometric mean of the non-zero root magnitudes)",
            "the predicted output starts from rest; the settling time (slowest digital pole decaying by " + o.SettlingDecay.ToString("G3", inv) + "), the delay and the interpolator length are skipped at both ends",
            "fractional delays by a Hann-windowed sinc interpolator of 64 taps (integer part shifted exactly)",
            "robust sigma = 1.4826 x median absolute deviation of the off-source residual (Rousseeuw and Croux 1993), floored at 1e-12 x output RMS (round-off); the residual is taken as Gaussian and white",
            string.Create(inv, $"on-source window ±{o.WindowSeconds} s around the candidate: only it is searched for the verdict; the threshold z per sample solves 2 Q(z) = 1 - (1 - P)^(1/n) with P = {o.FalseAlarmProbability:G3} and n the on-source samples (trials-corrected), so noise alone crosses it with probability P per stage"),
            "excursions outside the window are listed against the same rule for the off-source samples; they never set the candidate's verdict",
            string.Create(inv, $"model fit: magnitude-squared coherence of residual and input (Welch, Hann, 50 % overlap, Carter 1987) weighted by the residual's power; the model does not fit when that coherent fraction is >= {o.CoherentFractionLimit:0.##} or the off-source residual RMS is > {o.NoiseRatioLimit:0.##} x the stage's stated expected noise"),
            "verdict per stage: 'model does not fit' first (an excess under a wrong model can be neither ruled out nor confirmed), then 'excess found', else 'residual is noise'",
            "for a chain, each stage's input is the previous stage's recorded output",
        ];
    }
}
