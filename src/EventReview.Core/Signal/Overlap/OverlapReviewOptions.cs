using EventReview.Core.Time;

namespace EventReview.Core.Signal.Overlap;

/// <summary>Settings of the overlap check kind (<see cref="OverlapReview"/>).</summary>
/// <param name="Center">Centre of the on-source window (the candidate's GPS time).</param>
/// <param name="WindowSeconds">On-source correlation window, seconds.</param>
/// <param name="AllowedLagSeconds">Largest |lag| searched and allowed, seconds: the pair's light-travel time plus its timing tolerance (<see cref="Timing.PairWindow"/>) or given by hand.</param>
/// <param name="AllowedLagRule">How the allowed lag was set, in words (stored with the result).</param>
/// <param name="Conditioning">PSD, whitening, band and notches.</param>
/// <param name="OffSourceTrials">Off-source overlaps for the empirical p-value (0 for none).</param>
/// <param name="OverlapThreshold">Smallest overlap called consistent (our default 0.5: the p-value carries the significance).</param>
/// <param name="PValueThreshold">Largest off-source p-value called consistent.</param>
/// <param name="MapBeforeSeconds">Seconds before the centre in each site's time-frequency map.</param>
/// <param name="MapAfterSeconds">Seconds after the centre in each site's map.</param>
public sealed record OverlapReviewOptions(
    GpsTime Center,
    double WindowSeconds,
    double AllowedLagSeconds,
    string AllowedLagRule,
    ConditioningOptions Conditioning,
    int OffSourceTrials = 200,
    double OverlapThreshold = 0.5,
    double PValueThreshold = 0.01,
    double MapBeforeSeconds = 2,
    double MapAfterSeconds = 0.2);
