using MathNet.Numerics;

namespace EventReview.Core.Statistics;

/// <summary>Tail probabilities of the Poisson distribution, general purpose (counts of rare events).</summary>
public static class Poisson
{
    // P(N >= k | mu) = P(k, mu), the regularised lower incomplete gamma function (A&S 1964, eq. 26.4.21 via 6.5.1).

    /// <summary>
    /// Probability of at least <paramref name="k"/> events when <paramref name="mean"/> are expected:
    /// P(N &gt;= k | mu). Returns 1 for k &lt;= 0, and 0 for k &gt;= 1 with mu = 0.
    /// </summary>
    /// <param name="k">Observed count (events).</param>
    /// <param name="mean">Expected count mu &gt;= 0 (events, e.g. rate in Hz times time in s).</param>
    /// <exception cref="ArgumentOutOfRangeException">When the mean is negative or not finite.</exception>
    public static double ProbabilityAtLeast(long k, double mean)
    {
        if (!(mean >= 0.0) || double.IsInfinity(mean))
        {
            throw new ArgumentOutOfRangeException(nameof(mean), mean, "A finite, non-negative expected count was expected.");
        }

        if (k <= 0)
        {
            return 1.0;
        }

        if (mean == 0.0)
        {
            return 0.0;
        }

        return k == 1 ? -ExpMinusOne.Of(-mean) : SpecialFunctions.GammaLowerRegularized(k, mean);
    }

    /// <summary>
    /// Probability of at most <paramref name="k"/> events when <paramref name="mean"/> are expected:
    /// P(N &lt;= k | mu) = 1 - P(N &gt;= k + 1 | mu). Returns 0 for k &lt; 0.
    /// </summary>
    /// <param name="k">Observed count (events).</param>
    /// <param name="mean">Expected count mu &gt;= 0.</param>
    public static double ProbabilityAtMost(long k, double mean)
    {
        if (!(mean >= 0.0) || double.IsInfinity(mean))
        {
            throw new ArgumentOutOfRangeException(nameof(mean), mean, "A finite, non-negative expected count was expected.");
        }

        if (k < 0)
        {
            return 0.0;
        }

        return mean == 0.0 ? 1.0 : SpecialFunctions.GammaUpperRegularized(k + 1, mean);
    }
}
