using EventReview.Core.Time;

namespace EventReview.Core.Signal.Simulation;

/// <summary>What to simulate.</summary>
/// <param name="Start">GPS time of the first sample at every site.</param>
/// <param name="DurationSeconds">Length of each series, seconds (default 32).</param>
/// <param name="SampleRateHz">Sample rate, Hz (default 4096).</param>
/// <param name="Seed">Seed of System.Random; the same seed gives the same data.</param>
/// <param name="Chirp">The chirp; null for noise only.</param>
/// <param name="Coalescence">Reference coalescence GPS time (sites see it at Coalescence + DelaySeconds); null for the middle of the span.</param>
/// <param name="NetworkSnr">Target network matched-filter SNR; null to use <paramref name="AmplitudeStrain"/> as is.</param>
/// <param name="AmplitudeStrain">Strain scale multiplying the unit-scale waveform when no SNR is asked (default 1e-21).</param>
/// <param name="Asd">Noise ASD shape for every site; null for the default <see cref="AsdShape"/>.</param>
/// <param name="Glitches">Glitches to add.</param>
/// <param name="Lines">Lines to add to every site.</param>
/// <param name="AddNoise">False to produce the noiseless projected signal (default true).</param>
public sealed record SimulationOptions(
    GpsTime Start,
    double DurationSeconds = 32,
    double SampleRateHz = 4096,
    int Seed = 1,
    ChirpParameters? Chirp = null,
    GpsTime? Coalescence = null,
    double? NetworkSnr = 20,
    double AmplitudeStrain = 1e-21,
    AsdShape? Asd = null,
    IReadOnlyList<GlitchSpec>? Glitches = null,
    IReadOnlyList<LineSpec>? Lines = null,
    bool AddNoise = true);
