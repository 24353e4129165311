namespace EventReview.Core.Chain;

/// <summary>Settings of the data-chain check.</summary>
/// <param name="WindowSeconds">Half width of the on-source window around the candidate, seconds (default 1).</param>
/// <param name="SigmaThreshold">"Something added" when the largest residual excursion exceeds this many robust sigma (default 5).</param>
/// <param name="SettlingDecay">The filter's settling time is the time its slowest pole takes to decay by this factor (default 1e-9).</param>
public sealed record DataChainOptions(double WindowSeconds = 1.0, double SigmaThreshold = 5.0, double SettlingDecay = 1e-9);
