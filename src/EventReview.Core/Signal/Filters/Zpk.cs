using System.Numerics;

namespace EventReview.Core.Signal.Filters;

/// <summary>
/// A filter in zero-pole-gain form. For an analogue filter the zeros and poles are in the s-plane in rad/s and
/// H(s) = Gain · Π(s − z) / Π(s − p). For a digital filter they are in the z-plane (dimensionless) and
/// H(z) = Gain · Π(z − z_i) / Π(z − p_i). Which domain a value is in is stated by the method that returns it.
/// Complex zeros and poles must come in conjugate pairs so that the filter is real.
/// </summary>
/// <param name="Zeros">Zeros (rad/s for analogue filters, z-plane for digital ones).</param>
/// <param name="Poles">Poles (rad/s for analogue filters, z-plane for digital ones).</param>
/// <param name="Gain">Overall gain factor (not the pass-band gain).</param>
public sealed record Zpk(IReadOnlyList<Complex> Zeros, IReadOnlyList<Complex> Poles, double Gain)
{
    /// <summary>Number of poles minus number of zeros (the relative degree).</summary>
    public int RelativeDegree => Poles.Count - Zeros.Count;
}
