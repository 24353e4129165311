namespace EventReview.Core.Environment;

/// <summary>One trigger inside a site's lookup window.</summary>
/// <param name="Site">Site code.</param>
/// <param name="Channel">Channel name.</param>
/// <param name="Kind">Sensor kind, lower case ("other" for channels missing from the inventory).</param>
/// <param name="TriggerGps">Trigger time, GPS seconds.</param>
/// <param name="OffsetSeconds">Trigger time minus the site's arrival time (or case time), seconds.</param>
/// <param name="Snr">Trigger SNR.</param>
/// <param name="FrequencyHz">Trigger frequency, Hz, or null.</param>
/// <param name="WindowSeconds">Half window used for this channel's kind, seconds.</param>
/// <param name="ChannelRateHz">Channel's triggers per second over the rate window.</param>
/// <param name="ChanceProbability">1 - exp(-2 w R): probability that a trigger of this channel falls in the window by chance.</param>
/// <param name="Safe">Veto safety: true safe, false unsafe (responds to injections), null unknown.</param>
/// <param name="CouplingRatio">Coupling estimate / candidate strain, or null when no estimate was possible.</param>
/// <param name="CouplingStrain">Estimated strain from the coupling model, or null.</param>
/// <param name="CouplingFlagged">True when the coupling ratio reaches the flag fraction.</param>
/// <param name="Concern">True when this hit needs a human look (channel not shown unsafe).</param>
/// <param name="ChannelRateUncertaintyHz">1 sigma Poisson uncertainty of the channel rate, sqrt(N) / rate window.</param>
/// <param name="CouplingInputs">Which amplitudes the coupling estimate used ("candidate strain from strain data, sensor noise typed"), or null.</param>
public sealed record EnvironmentHit(
    string Site,
    string Channel,
    string Kind,
    double TriggerGps,
    double OffsetSeconds,
    double Snr,
    double? FrequencyHz,
    double WindowSeconds,
    double ChannelRateHz,
    double ChanceProbability,
    bool? Safe,
    double? CouplingRatio,
    double? CouplingStrain,
    bool CouplingFlagged,
    bool Concern,
    string? CouplingInputs = null,
    double ChannelRateUncertaintyHz = double.NaN);
