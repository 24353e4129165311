using EventReview.Core.Verdicts;

namespace EventReview.Core.Chain;

/// <summary>Result of one stage of the data-chain check (residual = recorded output - predicted output, in output units).</summary>
public sealed record ChainStageResult
{
    /// <summary>1-based stage number.</summary>
    public required int Stage { get; init; }

    /// <summary>RMS of the residual inside the on-source window.</summary>
    public required double ResidualRms { get; init; }

    /// <summary>RMS of the residual outside the window (settling time excluded).</summary>
    public required double OffSourceRms { get; init; }

    /// <summary>1.4826 x median absolute deviation of the off-source residual (floored at 1e-12 x output RMS for round-off).</summary>
    public required double RobustSigma { get; init; }

    /// <summary>
    /// 1 sigma statistical uncertainty of <see cref="RobustSigma"/>: 1.1664 sigma / sqrt(off-source samples), from the asymptotic
    /// variance 1.3605 sigma^2 / n of the normalised MAD for Gaussian data (Rousseeuw and Croux 1993, efficiency 36.75 %).
    /// </summary>
    public double RobustSigmaUncertainty => OffSourceSamples > 0 ? 1.1664 * RobustSigma / Math.Sqrt(OffSourceSamples) : double.NaN;

    /// <summary>Largest |residual - off-source median| inside the on-source window, in robust sigma.</summary>
    public required double MaxExcessSigma { get; init; }

    /// <summary>GPS time of that largest on-source excursion, seconds.</summary>
    public required double MaxExcessGps { get; init; }

    /// <summary>True when <see cref="MaxExcessSigma"/> exceeds <see cref="ThresholdSigma"/>: an on-source excess (an addition to the data, or a wrong model).</summary>
    public required bool Added { get; init; }

    /// <summary>Per-sample threshold in robust sigma: two-sided normal tail 2 Q(z) = 1 - (1 - P)^(1/n) for the stated P over n on-source samples.</summary>
    public required double ThresholdSigma { get; init; }

    /// <summary>The stated false-alarm probability P the threshold was set from.</summary>
    public required double FalseAlarmProbability { get; init; }

    /// <summary>On-source samples tested (n).</summary>
    public required int SamplesTested { get; init; }

    /// <summary>Excursions outside the on-source window above <see cref="OutsideThresholdSigma"/>, loudest first (at most 20); never part of the verdict.</summary>
    public required IReadOnlyList<ChainExcursion> OutsideWindow { get; init; }

    /// <summary>How many such excursions there were in all.</summary>
    public required int OutsideWindowCount { get; init; }

    /// <summary>Threshold for the off-source samples, set the same way from P over their number.</summary>
    public required double OutsideThresholdSigma { get; init; }

    /// <summary>Off-source samples (settling excluded).</summary>
    public required int OffSourceSamples { get; init; }

    /// <summary>The stage's stated expected residual RMS (output units), or null when the model states none.</summary>
    public double? ExpectedNoiseRms { get; init; }

    /// <summary>Off-source residual RMS / expected noise RMS, or null when no expected noise was stated.</summary>
    public double? NoiseRatio { get; init; }

    /// <summary>Residual power / recorded output power over the tested span (settling excluded).</summary>
    public required double ResidualToOutputPower { get; init; }

    /// <summary>Share of the residual's power coherent with the stage's input (see <c>ChainCoherence</c>), 0..1.</summary>
    public required double CoherentFraction { get; init; }

    /// <summary>Largest magnitude-squared coherence of residual and input over frequency, 0..1.</summary>
    public required double MaxCoherence { get; init; }

    /// <summary>Welch segments averaged for the coherence (its bias for unrelated series is about 1 / this).</summary>
    public required int CoherenceSegments { get; init; }

    /// <summary>False when the residual is dominated by a model that does not fit (coherent with the input, or well above the expected noise).</summary>
    public required bool ModelFits { get; init; }

    /// <summary>Seconds skipped at the start for the filter's settling and the delay.</summary>
    public required double SkippedStartSeconds { get; init; }

    /// <summary>Seconds skipped at the end.</summary>
    public required double SkippedEndSeconds { get; init; }

    /// <summary>Pre-warp frequency used, Hz, or null for none.</summary>
    public double? PrewarpHz { get; init; }

    /// <summary>Pure delay applied, seconds.</summary>
    public required double DelaySeconds { get; init; }

    /// <summary>"residual is noise", "excess found" or "model does not fit", with the numbers behind it.</summary>
    public required Judgement Judgement { get; init; }
}
