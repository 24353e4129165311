namespace EventReview.Core.Environment;

/// <summary>
/// Inputs of the coupling estimate (see <see cref="CouplingEstimate"/>).
/// </summary>
/// <param name="CandidateStrainAmplitude">The candidate's strain amplitude in the band (dimensionless strain, &gt; 0), in the same
/// amplitude measure as the sensor amplitudes (e.g. both peak amplitudes, or both amplitude spectral densities at the event).</param>
/// <param name="BandLowHz">Lower edge of the candidate's band, Hz.</param>
/// <param name="BandHighHz">Upper edge of the candidate's band, Hz (&gt; BandLowHz).</param>
/// <param name="FlagFraction">Flag when estimate / candidate &gt;= this (default 0.1: a common-practice margin, not a published rule).</param>
/// <param name="DefaultSensorNoiseAmplitude">Typical noise amplitude of a sensor, in sensor units, used when no per-channel value is given;
/// null means "no estimate without a per-channel value or spectrum".</param>
/// <param name="SensorNoiseAmplitudes">Per-channel noise amplitudes keyed "SITE:channel" (sensor units).</param>
/// <param name="SensorAmplitudeSpectra">Per-channel measured amplitude spectra at the event keyed "SITE:channel" (sensor units vs Hz);
/// when present they replace the SNR x noise model.</param>
public sealed record CouplingOptions(
    double CandidateStrainAmplitude,
    double BandLowHz,
    double BandHighHz,
    double FlagFraction = 0.1,
    double? DefaultSensorNoiseAmplitude = null,
    IReadOnlyDictionary<string, double>? SensorNoiseAmplitudes = null,
    IReadOnlyDictionary<string, FrequencyTable>? SensorAmplitudeSpectra = null);
