using EventReview.Core.Time;

namespace EventReview.Core.Environment;

/// <summary>A trigger (transient) reported by an auxiliary or environmental channel.</summary>
/// <param name="Site">Upper-case site code.</param>
/// <param name="Channel">Channel name.</param>
/// <param name="Time">Peak time of the trigger.</param>
/// <param name="Snr">Signal-to-noise ratio of the trigger (dimensionless, &gt;= 0).</param>
/// <param name="FrequencyHz">Central frequency in Hz, or null when not reported.</param>
/// <param name="DurationSeconds">Duration in seconds, or null when not reported.</param>
public sealed record AuxiliaryTrigger(string Site, string Channel, GpsTime Time, double Snr, double? FrequencyHz, double? DurationSeconds);
