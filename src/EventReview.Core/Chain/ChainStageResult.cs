namespace EventReview.Core.Chain;

/// <summary>Result of one stage of the data-chain check (residual = recorded output - predicted output, in output units).</summary>
/// <param name="Stage">1-based stage number.</param>
/// <param name="ResidualRms">RMS of the residual inside the on-source window.</param>
/// <param name="OffSourceRms">RMS of the residual outside the window (settling time excluded).</param>
/// <param name="RobustSigma">1.4826 x median absolute deviation of the off-source residual (floored at 1e-12 x output RMS for round-off).</param>
/// <param name="MaxExcessSigma">Largest |residual - off-source median| over the record (settling excluded), in robust sigma.</param>
/// <param name="MaxExcessGps">GPS time of that largest excursion, seconds.</param>
/// <param name="Added">True when MaxExcessSigma exceeds the threshold: something was added (or the model is wrong).</param>
/// <param name="SkippedStartSeconds">Seconds skipped at the start for the filter's settling and the delay.</param>
/// <param name="SkippedEndSeconds">Seconds skipped at the end.</param>
/// <param name="PrewarpHz">Pre-warp frequency used, Hz, or null for none.</param>
/// <param name="DelaySeconds">Pure delay applied, seconds.</param>
/// <param name="Verdict">"something added" or "nothing added".</param>
/// <param name="SamplesTested">Number of samples whose excursion was tested (record minus the skipped ends).</param>
/// <param name="NoiseFalseAlarmProbability">Probability that Gaussian noise alone crosses the threshold somewhere in the tested
/// samples: 1 - (1 - 2 Q(N))^samples, Q the one-sided normal tail (the threshold is applied per sample, so long records
/// carry a trials factor).</param>
public sealed record ChainStageResult(
    int Stage,
    double ResidualRms,
    double OffSourceRms,
    double RobustSigma,
    double MaxExcessSigma,
    double MaxExcessGps,
    bool Added,
    double SkippedStartSeconds,
    double SkippedEndSeconds,
    double? PrewarpHz,
    double DelaySeconds,
    string Verdict,
    int SamplesTested,
    double NoiseFalseAlarmProbability);
