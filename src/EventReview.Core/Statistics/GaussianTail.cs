using MathNet.Numerics;

namespace EventReview.Core.Statistics;

/// <summary>
/// The one-sided tail of the standard normal distribution and its inverse, used to quote a tail
/// probability as an equivalent Gaussian significance ("sigma").
/// </summary>
public static class GaussianTail
{
    // Q(x) = erfc(x / sqrt 2) / 2 (Abramowitz and Stegun 1964, eq. 26.2.29); erfc from MathNet (Boost port).

    /// <summary>
    /// One-sided upper tail Q(x) = P(Z &gt;= x) for a standard normal Z. Q(0) = 0.5, Q(-x) = 1 - Q(x);
    /// accurate to about 1e-14 relative for x up to 8 and beyond (no cancellation: computed through erfc).
    /// Returns NaN for NaN.
    /// </summary>
    /// <param name="x">Threshold in standard deviations.</param>
    public static double Q(double x) => 0.5 * SpecialFunctions.Erfc(x / Math.Sqrt(2.0));

    /// <summary>
    /// Inverse of <see cref="Q"/>: the x with Q(x) = p. Q^-1(0.5) = 0; negative for p &gt; 0.5.
    /// </summary>
    /// <param name="p">Tail probability in (0, 1).</param>
    /// <exception cref="ArgumentOutOfRangeException">When p is not strictly between 0 and 1.</exception>
    public static double InverseQ(double p)
    {
        if (!(p > 0.0 && p < 1.0))
        {
            throw new ArgumentOutOfRangeException(nameof(p), p, "A tail probability strictly between 0 and 1 was expected.");
        }

        return Math.Sqrt(2.0) * SpecialFunctions.ErfcInv(2.0 * p);
    }

    /// <summary>
    /// The one-sided Gaussian significance of a probability: Q^-1(p) when p &lt; 0.5, and 0 when p &gt;= 0.5
    /// (a result no rarer than a coin toss is quoted as "0 sigma", never as a negative number).
    /// A probability of exactly 0 gives positive infinity.
    /// </summary>
    /// <param name="p">False-alarm probability in [0, 1].</param>
    /// <exception cref="ArgumentOutOfRangeException">When p is NaN or outside [0, 1].</exception>
    public static double SigmaFromProbability(double p)
    {
        if (!(p >= 0.0 && p <= 1.0))
        {
            throw new ArgumentOutOfRangeException(nameof(p), p, "A probability between 0 and 1 was expected.");
        }

        if (p >= 0.5)
        {
            return 0.0;
        }

        return p == 0.0 ? double.PositiveInfinity : InverseQ(p);
    }
}
