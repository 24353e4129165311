using MathNet.Numerics;

namespace EventReview.Core.Statistics;

/// <summary>
/// The chi-square distribution with k degrees of freedom: its upper tail and upper quantile, used to turn a weighted sum of
/// squared residuals into a p-value (for example the sky fit of the timing check).
/// </summary>
public static class ChiSquare
{
    // P(X >= x) = Q(k/2, x/2), the regularised upper incomplete gamma function (Abramowitz and Stegun 1964, eq. 26.4.19);
    // Q from MathNet (continued fraction in the upper tail, so tiny tails keep their relative accuracy).

    /// <summary>
    /// Upper tail P(X ≥ x) for X ~ χ²(k). Returns 1 for x ≤ 0 and NaN for NaN.
    /// </summary>
    /// <param name="x">The statistic (dimensionless, a sum of squared standardised residuals).</param>
    /// <param name="degreesOfFreedom">k ≥ 1.</param>
    /// <exception cref="ArgumentOutOfRangeException">When k &lt; 1.</exception>
    public static double UpperTail(double x, int degreesOfFreedom)
    {
        if (degreesOfFreedom < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(degreesOfFreedom), degreesOfFreedom, "At least one degree of freedom was expected.");
        }

        if (double.IsNaN(x))
        {
            return double.NaN;
        }

        return x <= 0 ? 1.0 : SpecialFunctions.GammaUpperRegularized(degreesOfFreedom / 2.0, x / 2.0);
    }

    /// <summary>
    /// Upper quantile: the x with P(X ≥ x) = p for X ~ χ²(k) (for example 9.000 for k = 1, p = 2.7e-3). Found by bisection on
    /// <see cref="UpperTail"/> to a relative accuracy of about 1e-12.
    /// </summary>
    /// <param name="p">Tail probability in (0, 1).</param>
    /// <param name="degreesOfFreedom">k ≥ 1.</param>
    /// <exception cref="ArgumentOutOfRangeException">When p is not strictly between 0 and 1, or k &lt; 1.</exception>
    public static double UpperQuantile(double p, int degreesOfFreedom)
    {
        if (!(p > 0.0 && p < 1.0))
        {
            throw new ArgumentOutOfRangeException(nameof(p), p, "A tail probability strictly between 0 and 1 was expected.");
        }

        if (degreesOfFreedom < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(degreesOfFreedom), degreesOfFreedom, "At least one degree of freedom was expected.");
        }

        double lo = 0, hi = Math.Max(1.0, degreesOfFreedom);
        while (UpperTail(hi, degreesOfFreedom) > p)
        {
            lo = hi;
            hi *= 2;
        }

        for (int i = 0; i < 200 && hi - lo > 1e-13 * hi; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (UpperTail(mid, degreesOfFreedom) > p)
            {
                lo = mid;
            }
            else
            {
                hi = mid;
            }
        }

        return 0.5 * (lo + hi);
    }
}
