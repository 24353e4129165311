namespace EventReview.Core.Signal.Simulation;

/// <summary>What was injected at one site.</summary>
/// <param name="Code">Site code.</param>
/// <param name="ArrivalGps">GPS time of coalescence as seen at the site (decimal seconds, exact to the nanosecond).</param>
/// <param name="DelaySeconds">Arrival minus the reference coalescence time, seconds.</param>
/// <param name="FPlus">Plus response used.</param>
/// <param name="FCross">Cross response used.</param>
/// <param name="AmplitudeFactor">sqrt((F+ (1 + cos²ι)/2)² + (F× cos ι)²): the site's amplitude relative to an optimally placed site.</param>
/// <param name="PhaseOffsetRad">atan2(F× cos ι, F+ (1 + cos²ι)/2): the site's waveform is AmplitudeFactor · A cos(Φ − offset).</param>
/// <param name="SignRelativeToFirst">+1 or −1: sign of cos(offset − offset of the first site), the flip an overlap check should find.</param>
/// <param name="Snr">Realised optimal matched-filter SNR of the injected signal at the site (noise not included).</param>
/// <param name="PeakStrain">Largest |h| of the injected signal at the site.</param>
public sealed record SiteTruth(
    string Code,
    string ArrivalGps,
    double DelaySeconds,
    double FPlus,
    double FCross,
    double AmplitudeFactor,
    double PhaseOffsetRad,
    int SignRelativeToFirst,
    double Snr,
    double PeakStrain);
