namespace EventReview.Core.Timing;

/// <summary>
/// Settings of <see cref="TimingCheck"/>: <see cref="KSigma"/> multiplies the combined one-sigma timing uncertainty
/// sqrt(σa² + σb²) in each pair's allowed window (default 3); <see cref="MaxArrivalSpreadSeconds"/>, when set, rejects input whose
/// latest and earliest arrivals are further apart than this (a guard against a typed wrong time, not a physics check);
/// <see cref="FalseAlarmProbability"/> is the p-value below which the chi-square of the best sky direction (four or more sites)
/// makes the arrivals inconsistent (default 2.7e-3, the two-sided tail of the k = 3 pair rule).
/// </summary>
public sealed record TimingOptions(double KSigma = 3.0, double? MaxArrivalSpreadSeconds = null, double FalseAlarmProbability = TimingOptions.DefaultFalseAlarmProbability)
{
    /// <summary>2.7e-3: the two-sided Gaussian tail beyond 3σ (2 Q(3) = 2.6998e-3, Abramowitz and Stegun table 26.1), rounded.</summary>
    public const double DefaultFalseAlarmProbability = 2.7e-3;

    /// <summary>k = 3, no spread guard, false-alarm probability 2.7e-3.</summary>
    public static TimingOptions Default { get; } = new();
}
