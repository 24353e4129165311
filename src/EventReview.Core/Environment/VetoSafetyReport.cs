using EventReview.Core.Verdicts;

namespace EventReview.Core.Environment;

/// <summary>Veto-safety results for every channel that has triggers.</summary>
/// <param name="Channels">One entry per (site, channel), sorted by site then channel.</param>
/// <param name="WindowSeconds">Half window used, seconds.</param>
/// <param name="ProbabilityThreshold">Threshold below which a channel is unsafe.</param>
/// <param name="VetoWindowSeconds">Half window used for the deadtime, seconds.</param>
/// <param name="Judgement">"unsafe" when any channel responds to injections, "safe" when every tested channel is safe,
/// "not run" when none could be tested.</param>
/// <param name="Assumptions">Plain statements of the model (rates, windows, which injections count).</param>
public sealed record VetoSafetyReport(
    IReadOnlyList<ChannelSafety> Channels,
    double WindowSeconds,
    double ProbabilityThreshold,
    double VetoWindowSeconds,
    Judgement Judgement,
    IReadOnlyList<string> Assumptions)
{
    /// <summary>The safety flag of a channel, or null when the channel was not tested.</summary>
    public bool? SafetyOf(string site, string channel) =>
        Channels.FirstOrDefault(c => string.Equals(c.Site, site, StringComparison.OrdinalIgnoreCase) && c.Channel == channel)?.Safe;
}
