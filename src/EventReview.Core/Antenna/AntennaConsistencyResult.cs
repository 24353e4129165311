namespace EventReview.Core.Antenna;

/// <summary>
/// Result of the antenna-response consistency check for one pair of sites over a set of candidate directions
/// (a sky ring or the sky solutions). Fractions are over directions: a direction counts when at least one sampled
/// (ψ, ι) reproduces the observation. Ratios are |h_b| / |h_a| (dimensionless).
/// </summary>
public sealed record AntennaConsistencyResult(
    string A,
    string B,
    int ObservedSign,
    double ObservedAmplitudeRatio,
    double RatioTolerance,
    int DirectionCount,
    double MinExpectedRatio,
    double MaxExpectedRatio,
    double FractionAllowingSign,
    double FractionAllowingRatio,
    double FractionAllowingSignAndRatio,
    IReadOnlyList<bool> DirectionAllowed,
    string Verdict,
    string Model,
    IReadOnlyList<string> Assumptions);
