namespace EventReview.Web.Services.Checks;

/// <summary>
/// Parameters of the timing check as run from a case: k (window = light-travel + k σ) and, optionally, an observed
/// relative sign and amplitude ratio between two sites (from the overlap check or typed in) for the antenna-response test.
/// </summary>
public sealed record TimingCheckParameters(double KSigma = 3.0, string? PairA = null, string? PairB = null, int? ObservedSign = null,
    double? ObservedAmplitudeRatio = null, double RatioTolerance = 0.3)
{
    public bool HasObservation => PairA is not null && PairB is not null && ObservedSign is not null && ObservedAmplitudeRatio is not null;

    /// <exception cref="ArgumentException">When a value is out of range (message names it).</exception>
    public void Validate()
    {
        if (!double.IsFinite(KSigma) || KSigma <= 0 || KSigma > 10)
        {
            throw new ArgumentException("k (number of sigmas) must be > 0 and at most 10.", nameof(KSigma));
        }

        if (ObservedSign is not null and not (1 or -1))
        {
            throw new ArgumentException("Observed sign must be +1 or -1.", nameof(ObservedSign));
        }

        if (ObservedAmplitudeRatio is { } r && (!double.IsFinite(r) || r <= 0 || r > 100))
        {
            throw new ArgumentException("Observed amplitude ratio must be > 0 and at most 100.", nameof(ObservedAmplitudeRatio));
        }

        if (!double.IsFinite(RatioTolerance) || RatioTolerance <= 0 || RatioTolerance > 1)
        {
            throw new ArgumentException("Ratio tolerance must be in (0, 1].", nameof(RatioTolerance));
        }

        if (HasObservation && string.Equals(PairA, PairB, StringComparison.OrdinalIgnoreCase))
        {
            throw new ArgumentException("The antenna-response pair needs two different sites.", nameof(PairB));
        }
    }
}
