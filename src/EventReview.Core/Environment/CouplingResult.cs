namespace EventReview.Core.Environment;

/// <summary>Outcome of one coupling estimate.</summary>
/// <param name="StrainEstimate">Strain the disturbance could produce (dimensionless).</param>
/// <param name="FrequencyHz">Frequency at which the estimate was taken (the largest in-band value), Hz.</param>
/// <param name="Ratio">StrainEstimate / candidate strain amplitude.</param>
/// <param name="Flagged">True when Ratio &gt;= the flag fraction.</param>
/// <param name="Method">"spectrum" (coupling x measured amplitude spectrum) or "snr-x-noise" (coupling x SNR x sensor noise amplitude).</param>
/// <param name="CandidateStrainAmplitude">The candidate strain amplitude divided by.</param>
/// <param name="CandidateStrainSource">"strain data" or "typed".</param>
/// <param name="SensorAmplitudeSource">"spectrum", "sensor data" or "typed".</param>
public sealed record CouplingResult(
    double StrainEstimate,
    double FrequencyHz,
    double Ratio,
    bool Flagged,
    string Method,
    double CandidateStrainAmplitude = double.NaN,
    string CandidateStrainSource = "typed",
    string SensorAmplitudeSource = "typed");
