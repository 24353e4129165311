namespace EventReview.Core.Signal.Simulation;

/// <summary>A persistent sinusoidal line added to every site (e.g. a mains harmonic).</summary>
/// <param name="FrequencyHz">Line frequency, Hz.</param>
/// <param name="AmplitudeStrain">Amplitude in strain.</param>
public sealed record LineSpec(double FrequencyHz, double AmplitudeStrain);
