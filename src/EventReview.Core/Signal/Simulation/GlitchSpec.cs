using EventReview.Core.Time;

namespace EventReview.Core.Signal.Simulation;

/// <summary>A simulated glitch added to one site's strain.</summary>
/// <param name="SiteCode">Site that gets the glitch.</param>
/// <param name="Time">GPS time of the glitch's centre.</param>
/// <param name="Kind">Shape.</param>
/// <param name="FrequencyHz">Central frequency, Hz.</param>
/// <param name="Quality">Quality factor Q (ignored for short symmetric glitches, which use 1.5).</param>
/// <param name="AmplitudeStrain">Peak amplitude in strain.</param>
public sealed record GlitchSpec(string SiteCode, GpsTime Time, GlitchKind Kind, double FrequencyHz, double Quality, double AmplitudeStrain);
