using EventReview.Core.Verdicts;

namespace EventReview.Core.Environment;

/// <summary>Veto-safety result of one channel (record format 2: the binomial statistic).</summary>
/// <param name="Site">Site code.</param>
/// <param name="Channel">Channel name.</param>
/// <param name="Injections">Number of performed hardware injections at the site that were tested (n).</param>
/// <param name="Coincident">Injections with at least one trigger of the channel within ±w of their span (k, at most n).</param>
/// <param name="Expected">Number expected by chance, the sum over injections of q_i (n q when every injection lasts as long).</param>
/// <param name="ChanceProbabilityPerInjection">q = 1 - exp(-R (2 w + d)): the chance that one injection has a trigger of the channel
/// in its window by accident; the mean over injections when their durations d differ.</param>
/// <param name="BinomialProbability">P(K &gt;= k) for K ~ Binomial(n, q) (Poisson-binomial over the q_i when durations differ).</param>
/// <param name="Safe">False when <paramref name="BinomialProbability"/> is below the threshold (the channel responds to injections),
/// true otherwise, null when the channel could not be tested.</param>
/// <param name="RateHz">Channel trigger rate R, measured away from the injections: triggers outside every injection window /
/// the live time outside those windows, Hz.</param>
/// <param name="RateTriggers">Triggers counted for the rate (those inside an injection window are left out).</param>
/// <param name="RateExposureSeconds">Live time over which the rate was measured (injection windows removed), seconds.</param>
/// <param name="DeadtimeSeconds">Time a veto on this channel would remove: the union of ±veto window around each of its triggers, seconds.</param>
/// <param name="DeadtimeFraction">Deadtime / live time.</param>
/// <param name="Judgement">"safe", "unsafe" or "not run", with the numbers behind it.</param>
/// <param name="Note">Why the channel could not be tested, or null.</param>
public sealed record ChannelSafety(
    string Site,
    string Channel,
    int Injections,
    int Coincident,
    double Expected,
    double ChanceProbabilityPerInjection,
    double BinomialProbability,
    bool? Safe,
    double RateHz,
    int RateTriggers,
    double RateExposureSeconds,
    double DeadtimeSeconds,
    double DeadtimeFraction,
    Judgement Judgement,
    string? Note = null)
{
    /// <summary>1 sigma Poisson uncertainty of <see cref="RateHz"/>, sqrt(N) / T; NaN when no trigger was counted.</summary>
    public double RateUncertaintyHz => RateTriggers > 0 && RateExposureSeconds > 0 ? Math.Sqrt(RateTriggers) / RateExposureSeconds : double.NaN;
}
