namespace EventReview.Core.Signal.Simulation;

/// <summary>Parameters of a leading-order inspiral chirp with a simple ringdown.</summary>
/// <param name="ChirpMassMsun">Chirp mass in solar masses.</param>
/// <param name="LowFrequencyHz">Frequency at which the signal starts (with a five-cycle taper-in), Hz (default 20).</param>
/// <param name="CutoffFrequencyHz">Frequency where the inspiral stops and the ringdown starts, Hz; null for the equal-mass ISCO frequency.</param>
/// <param name="InclinationRad">Inclination of the orbit to the line of sight, rad (0 = face-on).</param>
/// <param name="PhaseRad">Gravitational-wave phase at coalescence, rad.</param>
/// <param name="RingdownCycles">E-folding time of the ringdown in cycles of the cut-off frequency (default 1.5).</param>
public sealed record ChirpParameters(
    double ChirpMassMsun,
    double LowFrequencyHz = 20,
    double? CutoffFrequencyHz = null,
    double InclinationRad = 0,
    double PhaseRad = 0,
    double RingdownCycles = 1.5);
