using EventReview.Core.Statistics;

namespace EventReview.Core.Significance;

/// <summary>
/// False-alarm figures from a background count.
/// </summary>
/// <param name="BackgroundCoincidences">Background coincidences counted.</param>
/// <param name="Louder">Those with ranking statistic &gt;= the candidate's.</param>
/// <param name="FarHz">False-alarm rate in Hz: Louder / background time, or 1 / background time when Louder is 0.</param>
/// <param name="FarIsBound">True when Louder is 0 and FarHz is only an upper bound.</param>
/// <param name="Fap">False-alarm probability over the observing time: 1 - exp(-FAR T_obs).</param>
/// <param name="Sigma">One-sided Gaussian significance of Fap; 0 when Fap &gt;= 0.5.</param>
public sealed record SignificanceFigures(long BackgroundCoincidences, long Louder, double FarHz, bool FarIsBound, double Fap, double Sigma)
{
    /// <summary>
    /// Computes FAR, FAP and sigma. FAP uses expm1 so that tiny probabilities keep their precision.
    /// </summary>
    /// <param name="backgroundCoincidences">All background coincidences.</param>
    /// <param name="louder">Background coincidences at least as loud as the candidate.</param>
    /// <param name="backgroundSeconds">Total background time in s (&gt; 0).</param>
    /// <param name="observingSeconds">Observing time T_obs in s (&gt; 0).</param>
    /// <exception cref="ArgumentOutOfRangeException">When a time is not positive.</exception>
    public static SignificanceFigures Compute(long backgroundCoincidences, long louder, double backgroundSeconds, double observingSeconds)
    {
        if (!(backgroundSeconds > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(backgroundSeconds), backgroundSeconds, "The background time must be positive (do the sites' analysed times overlap after the shifts?).");
        }

        if (!(observingSeconds > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(observingSeconds), observingSeconds, "The observing time must be positive.");
        }

        var bound = louder == 0;
        var far = (bound ? 1.0 : louder) / backgroundSeconds;

        // P(at least one false alarm in T_obs) for a Poisson process of rate FAR
        var fap = -ExpMinusOne.Of(-far * observingSeconds);
        return new SignificanceFigures(backgroundCoincidences, louder, far, bound, fap, GaussianTail.SigmaFromProbability(fap));
    }
}
