using EventReview.Core.Statistics;

namespace EventReview.Core.Significance;

/// <summary>
/// False-alarm figures from a background count. When no background coincidence is as loud, all three figures are bounds:
/// the FAR an upper bound at <see cref="BoundConfidence"/> (for 90 %: 2.3026 / T_bg, Gehrels 1986, table 1), the FAP an
/// upper bound and the sigma a lower bound.
/// </summary>
/// <param name="BackgroundCoincidences">Background coincidences counted.</param>
/// <param name="Louder">Those with ranking statistic &gt;= the candidate's.</param>
/// <param name="FarHz">False-alarm rate in Hz: Louder / background time, or the upper bound -ln(1 - CL) / background time when Louder is 0.</param>
/// <param name="FarIsBound">True when Louder is 0 and FarHz is only an upper bound.</param>
/// <param name="Fap">False-alarm probability over the observing time: 1 - exp(-FAR T_obs) (an upper bound with the FAR).</param>
/// <param name="Sigma">One-sided Gaussian significance of Fap; 0 when Fap &gt;= 0.5 (a lower bound with the FAR).</param>
/// <param name="BoundConfidence">Confidence level of the FAR bound (0.9), or null when the FAR is measured.</param>
public sealed record SignificanceFigures(long BackgroundCoincidences, long Louder, double FarHz, bool FarIsBound, double Fap, double Sigma, double? BoundConfidence = null)
{
    /// <summary>Confidence level of every FAR bound this version states.</summary>
    public const double DefaultBoundConfidence = 0.9;

    /// <summary>True when <see cref="Fap"/> is an upper bound (nothing as loud in the background).</summary>
    public bool FapIsBound => FarIsBound;

    /// <summary>True when <see cref="Sigma"/> is a lower bound (nothing as loud in the background).</summary>
    public bool SigmaIsBound => FarIsBound;

    /// <summary>
    /// Computes FAR, FAP and sigma. FAP uses expm1 so that tiny probabilities keep their precision.
    /// </summary>
    /// <param name="backgroundCoincidences">All background coincidences.</param>
    /// <param name="louder">Background coincidences at least as loud as the candidate.</param>
    /// <param name="backgroundSeconds">Total background time in s (&gt; 0).</param>
    /// <param name="observingSeconds">Observing time T_obs in s (&gt; 0).</param>
    /// <param name="boundConfidence">Confidence level of the FAR bound when <paramref name="louder"/> is 0 (default 0.9).</param>
    /// <exception cref="ArgumentOutOfRangeException">When a time is not positive.</exception>
    public static SignificanceFigures Compute(long backgroundCoincidences, long louder, double backgroundSeconds, double observingSeconds, double boundConfidence = DefaultBoundConfidence)
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
        var far = (bound ? Poisson.UpperLimitForNoEvents(boundConfidence) : louder) / backgroundSeconds;
        return FromRate(backgroundCoincidences, louder, far, bound, far * observingSeconds, bound ? boundConfidence : null);
    }

    /// <summary>Figures from a rate and the expected number of false alarms over the observing time(s).</summary>
    /// <param name="backgroundCoincidences">All background coincidences.</param>
    /// <param name="louder">Background coincidences at least as loud.</param>
    /// <param name="farHz">False-alarm rate, Hz.</param>
    /// <param name="isBound">True when the rate is an upper bound.</param>
    /// <param name="expectedFalseAlarms">Expected false alarms over the observing time (FAR x T_obs, or a sum over coincidence types).</param>
    /// <param name="boundConfidence">Confidence of the bound, or null.</param>
    public static SignificanceFigures FromRate(long backgroundCoincidences, long louder, double farHz, bool isBound, double expectedFalseAlarms, double? boundConfidence)
    {
        // P(at least one false alarm) for a Poisson process with this expected count
        var fap = -ExpMinusOne.Of(-expectedFalseAlarms);
        return new SignificanceFigures(backgroundCoincidences, louder, farHz, isBound, fap, GaussianTail.SigmaFromProbability(fap), boundConfidence);
    }
}
