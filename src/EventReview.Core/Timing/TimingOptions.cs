namespace EventReview.Core.Timing;

/// <summary>
/// Settings of <see cref="TimingCheck"/>: <see cref="KSigma"/> multiplies the combined one-sigma timing uncertainty
/// sqrt(σa² + σb²) in the allowed window (default 3); <see cref="MaxArrivalSpreadSeconds"/>, when set, rejects input whose
/// latest and earliest arrivals are further apart than this (a guard against a typed wrong time, not a physics check).
/// </summary>
public sealed record TimingOptions(double KSigma = 3.0, double? MaxArrivalSpreadSeconds = null)
{
    /// <summary>k = 3, no spread guard.</summary>
    public static TimingOptions Default { get; } = new();
}
