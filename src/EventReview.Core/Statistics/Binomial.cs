using MathNet.Numerics;

namespace EventReview.Core.Statistics;

/// <summary>Binomial counting probabilities, used by the veto-safety test.</summary>
public static class Binomial
{
    /// <summary>
    /// P(K &gt;= k) for K ~ Binomial(n, q): the regularised incomplete beta function I_q(k, n - k + 1)
    /// (Abramowitz and Stegun 26.5.24), accurate in the far tail where 1 - CDF would cancel.
    /// Returns 1 for k &lt;= 0 and 0 for k &gt; n.
    /// </summary>
    /// <param name="k">Threshold count.</param>
    /// <param name="n">Number of trials (&gt;= 0).</param>
    /// <param name="q">Probability of success per trial, in [0, 1].</param>
    /// <exception cref="ArgumentOutOfRangeException">When n is negative or q is outside [0, 1].</exception>
    public static double AtLeast(int k, int n, double q)
    {
        if (n < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(n), n, "The number of trials must be >= 0.");
        }

        if (!(q >= 0 && q <= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(q), q, "The probability per trial must be in [0, 1].");
        }

        if (k <= 0)
        {
            return 1.0;
        }

        if (k > n)
        {
            return 0.0;
        }

        if (q == 0)
        {
            return 0.0;
        }

        if (q == 1)
        {
            return 1.0;
        }

        return Math.Clamp(SpecialFunctions.BetaRegularized(k, n - k + 1, q), 0.0, 1.0);
    }

    /// <summary>
    /// P(K &gt;= k) for K the number of successes in independent trials with their own probabilities (the Poisson-binomial
    /// distribution), by the exact recursion over trials (each step convolves with one Bernoulli; only sums of positive
    /// terms, so the far tail keeps its digits). Equals <see cref="AtLeast(int, int, double)"/> when every probability is the same.
    /// </summary>
    /// <param name="k">Threshold count.</param>
    /// <param name="probabilities">Probability of success of each trial, each in [0, 1].</param>
    /// <exception cref="ArgumentOutOfRangeException">When a probability is outside [0, 1].</exception>
    public static double AtLeast(int k, IReadOnlyList<double> probabilities)
    {
        ArgumentNullException.ThrowIfNull(probabilities);
        var n = probabilities.Count;
        if (k <= 0)
        {
            return 1.0;
        }

        if (k > n)
        {
            return 0.0;
        }

        var pmf = new double[n + 1];
        pmf[0] = 1.0;
        for (var i = 0; i < n; i++)
        {
            var q = probabilities[i];
            if (!(q >= 0 && q <= 1))
            {
                throw new ArgumentOutOfRangeException(nameof(probabilities), q, "Each probability must be in [0, 1].");
            }

            for (var j = i + 1; j >= 1; j--)
            {
                pmf[j] = (pmf[j] * (1 - q)) + (pmf[j - 1] * q);
            }

            pmf[0] *= 1 - q;
        }

        var tail = 0.0;
        for (var j = n; j >= k; j--)
        {
            tail += pmf[j];
        }

        return Math.Clamp(tail, 0.0, 1.0);
    }
}
