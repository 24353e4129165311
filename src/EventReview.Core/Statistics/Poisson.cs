using MathNet.Numerics;

namespace EventReview.Core.Statistics;

/// <summary>Poisson counting probabilities used by the coincidence and veto-safety checks.</summary>
public static class Poisson
{
    /// <summary>
    /// P(N &gt;= k) for N ~ Poisson(mean). Computed as the regularised lower incomplete gamma function P(k, mean)
    /// (Abramowitz and Stegun 6.5.1 and 26.4.21), which stays accurate in the far tail where 1 - CDF would cancel.
    /// Returns 1 for k &lt;= 0 and 0 for k &gt; 0 when the mean is 0.
    /// </summary>
    /// <param name="k">Threshold count.</param>
    /// <param name="mean">Expected count, finite and &gt;= 0.</param>
    public static double AtLeast(int k, double mean)
    {
        if (!double.IsFinite(mean) || mean < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(mean), mean, "Poisson mean must be finite and >= 0.");
        }

        if (k <= 0)
        {
            return 1.0;
        }

        if (mean == 0)
        {
            return 0.0;
        }

        return Math.Clamp(SpecialFunctions.GammaLowerRegularized(k, mean), 0.0, 1.0);
    }

    /// <summary>
    /// Probability that at least one event of a Poisson stream of rate <paramref name="rateHz"/> falls inside a window
    /// of +-<paramref name="halfWindowSeconds"/>: 1 - exp(-2 w R), computed with expm1 so tiny values keep their digits.
    /// </summary>
    public static double ChanceCoincidence(double halfWindowSeconds, double rateHz)
    {
        if (!double.IsFinite(halfWindowSeconds) || halfWindowSeconds < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(halfWindowSeconds), halfWindowSeconds, "Half window must be finite and >= 0 s.");
        }

        if (!double.IsFinite(rateHz) || rateHz < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(rateHz), rateHz, "Rate must be finite and >= 0 Hz.");
        }

        return -ExpMinusOne.Of(-2.0 * halfWindowSeconds * rateHz);
    }

    /// <summary>
    /// Rate of accidental coincidences between two independent Poisson streams of rates R1, R2 (Hz) with a
    /// coincidence window of +-tau seconds: 2 tau R1 R2 (Knoll, "Radiation Detection and Measurement", coincidence chapter).
    /// Valid when 2 tau R2 &lt;&lt; 1; the exact event form is R1 (1 - exp(-2 tau R2)).
    /// </summary>
    public static double AccidentalRateHz(double tauSeconds, double rate1Hz, double rate2Hz)
    {
        if (!double.IsFinite(tauSeconds) || tauSeconds < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(tauSeconds), tauSeconds, "Coincidence half window must be finite and >= 0 s.");
        }

        if (!double.IsFinite(rate1Hz) || rate1Hz < 0 || !double.IsFinite(rate2Hz) || rate2Hz < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(rate1Hz), rate1Hz, "Rates must be finite and >= 0 Hz.");
        }

        return 2.0 * tauSeconds * rate1Hz * rate2Hz;
    }


    /// <summary>
    /// Upper limit on a Poisson mean when no event was seen, at confidence level <paramref name="confidence"/>:
    /// the mean mu with P(0 | mu) = exp(-mu) = 1 - CL, so mu = -ln(1 - CL); 2.3026 at 90 % (Gehrels 1986, ApJ 303, 336, table 1).
    /// Divide by the time observed for a rate bound.
    /// </summary>
    /// <param name="confidence">Confidence level in (0, 1), e.g. 0.9.</param>
    /// <exception cref="ArgumentOutOfRangeException">When the level is not strictly between 0 and 1.</exception>
    public static double UpperLimitForNoEvents(double confidence)
    {
        if (!(confidence > 0 && confidence < 1))
        {
            throw new ArgumentOutOfRangeException(nameof(confidence), confidence, "A confidence level strictly between 0 and 1 was expected.");
        }

        return -Math.Log(1 - confidence);
    }

    /// <summary>P(N &gt;= k) for a Poisson count with the given mean (same as <see cref="AtLeast"/>, for 64-bit counts).</summary>
    public static double ProbabilityAtLeast(long k, double mean) =>
        k > int.MaxValue ? (mean == 0 ? 0.0 : SpecialFunctions.GammaLowerRegularized(k, mean)) : AtLeast((int)Math.Max(k, int.MinValue), mean);

    /// <summary>P(N &lt;= k) for a Poisson count with the given mean: Q(k + 1, mean), the regularised upper incomplete gamma function.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When the mean is negative or not finite.</exception>
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
