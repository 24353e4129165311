namespace EventReview.Core.Chain;

/// <summary>Settings of the data-chain check.</summary>
/// <param name="WindowSeconds">Half width of the on-source window around the candidate, seconds (default 1). Only this window is
/// searched for the candidate's verdict.</param>
/// <param name="FalseAlarmProbability">Probability that Gaussian noise alone crosses the threshold somewhere in the on-source
/// samples of a stage (default 1e-3); the per-sample threshold follows from it and the number of samples tested.</param>
/// <param name="SettlingDecay">The filter's settling time is the time its slowest pole takes to decay by this factor (default 1e-9).</param>
/// <param name="CoherentFractionLimit">The model does not fit when at least this share of the residual's power is coherent with
/// the input (default 0.5: the mismatch then dominates the residual; our choice).</param>
/// <param name="NoiseRatioLimit">The model does not fit when the off-source residual RMS exceeds the stage's stated expected
/// noise by more than this factor (default 1.5; our choice).</param>
public sealed record DataChainOptions(double WindowSeconds = 1.0, double FalseAlarmProbability = 1e-3, double SettlingDecay = 1e-9,
    double CoherentFractionLimit = 0.5, double NoiseRatioLimit = 1.5);
