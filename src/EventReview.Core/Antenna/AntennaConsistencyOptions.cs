namespace EventReview.Core.Antenna;

/// <summary>
/// Settings of <see cref="AntennaConsistency"/>. <see cref="RatioTolerance"/> is fractional: an expected ratio r
/// matches the observed ratio R when R/(1+tol) ≤ r ≤ R(1+tol). ψ is sampled uniformly in [0°, 180°), |cos ι|
/// uniformly in [0, 1] (the sign of cos ι does not change ratio or sign in the model).
/// </summary>
public sealed record AntennaConsistencyOptions(double RatioTolerance = 0.3, int PsiSamples = 36, int InclinationSamples = 11)
{
    /// <summary>The defaults: 30 % ratio tolerance, 36 polarisation angles, 11 inclinations.</summary>
    public static AntennaConsistencyOptions Default { get; } = new();
}
