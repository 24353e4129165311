namespace EventReview.Core.Environment;

/// <summary>
/// Inputs of the coupling estimate (see <see cref="CouplingEstimate"/>). Values read from data take precedence over typed
/// numbers: the candidate's strain amplitude at a site from <paramref name="MeasuredStrainAmplitudes"/> (strain data) before
/// <paramref name="CandidateStrainAmplitude"/> (typed); a sensor's noise amplitude from <paramref name="MeasuredSensorNoiseAmplitudes"/>
/// (sensor data) before <paramref name="SensorNoiseAmplitudes"/> and <paramref name="DefaultSensorNoiseAmplitude"/> (typed).
/// Every result says which was used.
/// </summary>
/// <param name="CandidateStrainAmplitude">Typed candidate strain amplitude in the band (dimensionless, &gt; 0), used for sites without
/// strain data; null: no estimate at such sites. Same amplitude measure as the sensor amplitudes (peak-like: a trigger of SNR rho
/// stands rho times above the sensor's RMS noise).</param>
/// <param name="BandLowHz">Lower edge of the candidate's band, Hz.</param>
/// <param name="BandHighHz">Upper edge of the candidate's band, Hz (&gt; BandLowHz).</param>
/// <param name="FlagFraction">Flag when estimate / candidate &gt;= this (default 0.1: a common-practice margin, not a published rule).</param>
/// <param name="DefaultSensorNoiseAmplitude">Typed noise amplitude (RMS in the band, sensor units) of any sensor without its own value; null means
/// "no estimate without a per-channel value, sensor data or spectrum".</param>
/// <param name="SensorNoiseAmplitudes">Typed per-channel noise amplitudes keyed by <see cref="ChannelName.Qualified"/> of site and channel (sensor units).</param>
/// <param name="SensorAmplitudeSpectra">Per-channel measured amplitude spectra at the event keyed by <see cref="ChannelName.Qualified"/> of site and channel (sensor units vs Hz);
/// when present they replace the SNR x noise model.</param>
/// <param name="MeasuredStrainAmplitudes">Candidate strain amplitude per site code read from strain data (<see cref="CouplingMeasurement.CandidateStrain"/>).</param>
/// <param name="MeasuredSensorNoiseAmplitudes">Sensor noise amplitude per channel (key <see cref="ChannelName.Qualified"/>) read from sensor data (<see cref="CouplingMeasurement.SensorNoise"/>).</param>
public sealed record CouplingOptions(
    double? CandidateStrainAmplitude,
    double BandLowHz,
    double BandHighHz,
    double FlagFraction = 0.1,
    double? DefaultSensorNoiseAmplitude = null,
    IReadOnlyDictionary<string, double>? SensorNoiseAmplitudes = null,
    IReadOnlyDictionary<string, FrequencyTable>? SensorAmplitudeSpectra = null,
    IReadOnlyDictionary<string, double>? MeasuredStrainAmplitudes = null,
    IReadOnlyDictionary<string, double>? MeasuredSensorNoiseAmplitudes = null);
