namespace EventReview.Core.Timing;

/// <summary>
/// Parameters of the timing check kind as run from a case or the CLI (stored with each record): k (pair window = light-travel +
/// k σ), the false-alarm probability of the sky-fit chi-square (four or more sites) and, optionally, an observed relative sign and
/// amplitude ratio between two sites (from the overlap check or typed in) for the antenna-response test.
/// </summary>
/// <param name="KSigma">k in each pair's window (default 3).</param>
/// <param name="PairA">First site of the antenna-response pair (null: no antenna-response test).</param>
/// <param name="PairB">Second site of the pair.</param>
/// <param name="ObservedSign">+1 or −1: how B's waveform must be multiplied to match A's.</param>
/// <param name="ObservedAmplitudeRatio">|h_B| / |h_A| (&gt; 0).</param>
/// <param name="RatioTolerance">Ratios within a factor 1 + tolerance of the observed one match (default 0.3).</param>
/// <param name="FalseAlarmProbability">p-value below which the sky fit makes the arrivals inconsistent (default 2.7e-3).</param>
public sealed record TimingCheckParameters(double KSigma = 3.0, string? PairA = null, string? PairB = null, int? ObservedSign = null,
    double? ObservedAmplitudeRatio = null, double RatioTolerance = 0.3, double FalseAlarmProbability = TimingOptions.DefaultFalseAlarmProbability)
{
    /// <summary>True when a pair, a sign and a ratio are all given, so the antenna-response test runs.</summary>
    public bool HasObservation => PairA is not null && PairB is not null && ObservedSign is not null && ObservedAmplitudeRatio is not null;

    /// <summary>
    /// True when some but not all of the pair, sign and ratio are given: the antenna-response test can then neither run nor be
    /// left out silently, so forms and the command line refuse it.
    /// </summary>
    public bool HasPartialObservation => !HasObservation && (PairA ?? PairB ?? (object?)ObservedSign ?? ObservedAmplitudeRatio) is not null;

    /// <exception cref="ArgumentException">When a value is out of range (message names it).</exception>
    public void Validate()
    {
        if (!double.IsFinite(KSigma) || KSigma <= 0 || KSigma > 10)
        {
            throw new ArgumentException("k (number of sigmas) must be > 0 and at most 10.", nameof(KSigma));
        }

        if (!(FalseAlarmProbability > 0 && FalseAlarmProbability <= 0.5))
        {
            throw new ArgumentException("The false-alarm probability of the sky fit must be > 0 and at most 0.5.", nameof(FalseAlarmProbability));
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
