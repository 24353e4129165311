namespace EventReview.Core.Environment;

/// <summary>
/// Simplified coupling model: strain = coupling(f) x sensor amplitude, compared with the candidate's strain amplitude.
/// <list type="bullet">
/// <item>With a measured amplitude spectrum A(f) of the sensor at the event: estimate = max over the candidate band of
/// C(f) A(f), evaluated at the band edges and every tabulated frequency of either table inside the band (both are
/// log-log interpolated, so the maximum of the product lies on one of these points).</item>
/// <item>Otherwise the sensor amplitude is taken as SNR x the sensor's typical noise amplitude (a trigger of SNR rho stands
/// rho times above the noise), and C is taken at the trigger's frequency when it lies in the band, else the largest
/// C in the band (conservative).</item>
/// </list>
/// The model ignores phase, non-linear coupling and the spread of the disturbance over frequency: it is an order-of-magnitude
/// screen that tells a person where to look, not a measurement.
/// </summary>
public static class CouplingEstimate
{
    /// <summary>
    /// Estimates the strain a disturbance could produce, or null when no estimate is possible (no noise amplitude or
    /// spectrum for the channel, or the tables do not cover any of the band).
    /// </summary>
    /// <param name="coupling">Coupling function, strain per sensor unit vs Hz.</param>
    /// <param name="options">Band, candidate amplitude, flag fraction and sensor amplitudes.</param>
    /// <param name="channelKey">"SITE:channel" key into the per-channel dictionaries.</param>
    /// <param name="snr">Trigger SNR (&gt;= 0).</param>
    /// <param name="frequencyHz">Trigger frequency in Hz, or null.</param>
    public static CouplingResult? Estimate(FrequencyTable coupling, CouplingOptions options, string channelKey, double snr, double? frequencyHz)
    {
        ArgumentNullException.ThrowIfNull(coupling);
        Validate(options);
        if (options.SensorAmplitudeSpectra?.TryGetValue(channelKey, out var spectrum) == true)
        {
            var best = Grid(options, coupling.FrequenciesHz.Concat(spectrum.FrequenciesHz))
                .Select(f => (F: f, V: coupling.At(f) * spectrum.At(f)))
                .Where(p => p.V is not null)
                .OrderByDescending(p => p.V!.Value)
                .FirstOrDefault();
            return best.V is { } v ? Result(v, best.F, options, "spectrum") : null;
        }

        double? noise = options.SensorNoiseAmplitudes?.TryGetValue(channelKey, out var n) == true ? n : options.DefaultSensorNoiseAmplitude;
        if (noise is null)
        {
            return null;
        }

        if (frequencyHz is { } f0 && f0 >= options.BandLowHz && f0 <= options.BandHighHz && coupling.At(f0) is { } c0)
        {
            return Result(c0 * snr * noise.Value, f0, options, "snr-x-noise");
        }

        var max = Grid(options, coupling.FrequenciesHz)
            .Select(f => (F: f, V: coupling.At(f)))
            .Where(p => p.V is not null)
            .OrderByDescending(p => p.V!.Value)
            .FirstOrDefault();
        return max.V is { } cMax ? Result(cMax * snr * noise.Value, max.F, options, "snr-x-noise") : null;
    }

    private static IEnumerable<double> Grid(CouplingOptions o, IEnumerable<double> nodes) =>
        nodes.Where(f => f > o.BandLowHz && f < o.BandHighHz).Append(o.BandLowHz).Append(o.BandHighHz).Distinct();

    private static CouplingResult Result(double strain, double f, CouplingOptions o, string method)
    {
        var ratio = strain / o.CandidateStrainAmplitude;
        return new CouplingResult(strain, f, ratio, ratio >= o.FlagFraction, method);
    }

    private static void Validate(CouplingOptions o)
    {
        ArgumentNullException.ThrowIfNull(o);
        if (!(o.CandidateStrainAmplitude > 0) || !double.IsFinite(o.CandidateStrainAmplitude))
        {
            throw new ArgumentOutOfRangeException(nameof(o), o.CandidateStrainAmplitude, "CandidateStrainAmplitude must be finite and > 0.");
        }

        if (!(o.BandLowHz > 0) || !(o.BandHighHz > o.BandLowHz) || !double.IsFinite(o.BandHighHz))
        {
            throw new ArgumentOutOfRangeException(nameof(o), o.BandHighHz, "Band must satisfy 0 < BandLowHz < BandHighHz.");
        }

        if (!(o.FlagFraction > 0) || !double.IsFinite(o.FlagFraction))
        {
            throw new ArgumentOutOfRangeException(nameof(o), o.FlagFraction, "FlagFraction must be finite and > 0.");
        }
    }
}
