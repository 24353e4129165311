using EventReview.Core.Time;

namespace EventReview.Core.Significance;

/// <summary>
/// One single-site trigger: a transient found by a search in one site's data.
/// </summary>
/// <param name="Time">Peak time on the GPS scale (whole nanoseconds).</param>
/// <param name="Snr">Signal-to-noise ratio (dimensionless, finite, &gt;= 0).</param>
/// <param name="ChirpMass">Chirp mass in solar masses when the search estimated one; null otherwise.</param>
/// <param name="FrequencyHz">Characteristic frequency in Hz when given; null otherwise.</param>
public readonly record struct Trigger(GpsTime Time, double Snr, double? ChirpMass = null, double? FrequencyHz = null);
