namespace EventReview.Core.Environment;

/// <summary>
/// Simplified coupling model: strain = coupling(f) x sensor amplitude, compared with the candidate's strain amplitude.
/// <list type="bullet">
/// <item>With a measured amplitude spectrum A(f) of the sensor at the event: estimate = max over the candidate band of
/// C(f) A(f), evaluated at the band edges and every tabulated frequency of either table inside the band (both are
/// log-log interpolated, so the maximum of the product lies on one of these points).</item>
/// <item>Otherwise the sensor amplitude is taken as SNR x the sensor's noise amplitude (a trigger of SNR rho stands
/// rho times above the noise; the noise read from sensor data when given, else typed), and C is taken at the trigger's frequency when it lies in the band, else the largest
/// C in the band (conservative).</item>
/// </list>
/// The model ignores phase, non-linear coupling and the spread of the disturbance over frequency: it is an order-of-magnitude
/// screen that tells a person where to look, not a measurement.
/// </summary>
public static class CouplingEstimate
{
    /// <summary>
    /// Estimates the strain a disturbance could produce, or null when no estimate is possible (no candidate amplitude for the
    /// site, no noise amplitude or spectrum for the channel, or the tables do not cover any of the band).
    /// </summary>
    /// <param name="coupling">Coupling function, strain per sensor unit vs Hz.</param>
    /// <param name="options">Band, candidate amplitudes, flag fraction and sensor amplitudes.</param>
    /// <param name="channelKey">Key into the per-channel dictionaries, <see cref="ChannelName.Qualified"/> of site and channel; the site is the part before the first slash.</param>
    /// <param name="snr">Trigger SNR (&gt;= 0).</param>
    /// <param name="frequencyHz">Trigger frequency in Hz, or null.</param>
    public static CouplingResult? Estimate(FrequencyTable coupling, CouplingOptions options, string channelKey, double snr, double? frequencyHz)
    {
        ArgumentNullException.ThrowIfNull(coupling);
        ArgumentNullException.ThrowIfNull(channelKey);
        Validate(options);
        var site = ChannelName.SiteOf(channelKey);
        (double Value, string Source)? candidate = options.MeasuredStrainAmplitudes?.TryGetValue(site, out var hm) == true
            ? (hm, "strain data")
            : options.CandidateStrainAmplitude is { } typed ? (typed, "typed") : null;
        if (candidate is not { } h)
        {
            return null;
        }

        if (options.SensorAmplitudeSpectra?.TryGetValue(channelKey, out var spectrum) == true)
        {
            var best = Grid(options, coupling.FrequenciesHz.Concat(spectrum.FrequenciesHz))
                .Select(f => (F: f, V: coupling.At(f) * spectrum.At(f)))
                .Where(p => p.V is not null)
                .OrderByDescending(p => p.V!.Value)
                .FirstOrDefault();
            return best.V is { } v ? Result(v, best.F, options, "spectrum", h, "spectrum") : null;
        }

        (double Value, string Source)? noise = options.MeasuredSensorNoiseAmplitudes?.TryGetValue(channelKey, out var nm) == true
            ? (nm, "sensor data")
            : options.SensorNoiseAmplitudes?.TryGetValue(channelKey, out var n) == true ? (n, "typed")
            : options.DefaultSensorNoiseAmplitude is { } d ? (d, "typed") : null;
        if (noise is not { } a)
        {
            return null;
        }

        if (frequencyHz is { } f0 && f0 >= options.BandLowHz && f0 <= options.BandHighHz && coupling.At(f0) is { } c0)
        {
            return Result(c0 * snr * a.Value, f0, options, "snr-x-noise", h, a.Source);
        }

        var max = Grid(options, coupling.FrequenciesHz)
            .Select(f => (F: f, V: coupling.At(f)))
            .Where(p => p.V is not null)
            .OrderByDescending(p => p.V!.Value)
            .FirstOrDefault();
        return max.V is { } cMax ? Result(cMax * snr * a.Value, max.F, options, "snr-x-noise", h, a.Source) : null;
    }

    private static IEnumerable<double> Grid(CouplingOptions o, IEnumerable<double> nodes) =>
        nodes.Where(f => f > o.BandLowHz && f < o.BandHighHz).Append(o.BandLowHz).Append(o.BandHighHz).Distinct();

    private static CouplingResult Result(double strain, double f, CouplingOptions o, string method, (double Value, string Source) candidate, string sensorSource)
    {
        var ratio = strain / candidate.Value;
        return new CouplingResult(strain, f, ratio, ratio >= o.FlagFraction, method, candidate.Value, candidate.Source, sensorSource);
    }

    private static void Validate(CouplingOptions o)
    {
        ArgumentNullException.ThrowIfNull(o);
        if (o.CandidateStrainAmplitude is { } h && (!(h > 0) || !double.IsFinite(h)))
        {
            throw new ArgumentOutOfRangeException(nameof(o), h, "CandidateStrainAmplitude must be finite and > 0 when given.");
        }

        if (o.MeasuredStrainAmplitudes?.Values.Any(v => !(v > 0) || !double.IsFinite(v)) == true
            || o.MeasuredSensorNoiseAmplitudes?.Values.Any(v => !(v > 0) || !double.IsFinite(v)) == true)
        {
            throw new ArgumentOutOfRangeException(nameof(o), "Amplitudes read from data must be finite and > 0.");
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
