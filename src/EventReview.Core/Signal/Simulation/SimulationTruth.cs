namespace EventReview.Core.Signal.Simulation;

/// <summary>The truth record of a simulation (serialises to camelCase JSON).</summary>
/// <param name="Seed">Seed used.</param>
/// <param name="ChirpMassMsun">Injected chirp mass, solar masses (null for noise only).</param>
/// <param name="CoalescenceGps">Reference coalescence GPS time (decimal seconds), or null.</param>
/// <param name="NetworkSnr">Realised network SNR, sqrt(Σ site SNR²).</param>
/// <param name="AmplitudeStrain">Strain scale applied to the unit-scale waveform.</param>
/// <param name="Sites">Per-site truth.</param>
/// <param name="Assumptions">Conventions and approximations.</param>
public sealed record SimulationTruth(
    int Seed,
    double? ChirpMassMsun,
    string? CoalescenceGps,
    double NetworkSnr,
    double AmplitudeStrain,
    IReadOnlyList<SiteTruth> Sites,
    IReadOnlyList<string> Assumptions);
