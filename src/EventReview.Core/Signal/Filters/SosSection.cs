namespace EventReview.Core.Signal.Filters;

/// <summary>
/// One second-order section of a digital filter, normalised so that a0 = 1:
/// H(z) = (B0 + B1 z⁻¹ + B2 z⁻²) / (1 + A1 z⁻¹ + A2 z⁻²).
/// </summary>
public readonly record struct SosSection(double B0, double B1, double B2, double A1, double A2)
{
    /// <summary>Gain at DC (z = 1): (B0 + B1 + B2) / (1 + A1 + A2). Infinite for a pole at z = 1.</summary>
    public double DcGain => (B0 + B1 + B2) / (1 + A1 + A2);
}
