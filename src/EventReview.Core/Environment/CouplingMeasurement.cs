using System.Globalization;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Filters;
using EventReview.Core.Time;
using EventReview.Core.Formatting;
using EventReview.Core.Inputs;

namespace EventReview.Core.Environment;

/// <summary>
/// Reads the two amplitudes the coupling screen compares from data instead of typed numbers: the candidate's strain
/// amplitude from a site's strain series and a sensor's noise amplitude from its own series. Both are band-passed to the
/// candidate's band with a zero-phase 4th-order Butterworth filter (the band's top is capped at 0.9 x Nyquist), so that the
/// two numbers are in the same band as the coupling function is read in.
/// </summary>
public static class CouplingMeasurement
{
    /// <summary>Filter settling time skipped at each end of a series, seconds.</summary>
    public const double EdgeSeconds = 0.5;

    /// <summary>
    /// The candidate's strain amplitude at one site: the largest |h| of the band-passed strain within ±<paramref name="halfWindowSeconds"/>
    /// of the arrival. A peak, in the same measure as "SNR x RMS noise" of a sensor trigger. It includes the detector noise in that
    /// window, so for a weak candidate it overstates the signal and the coupling ratio comes out low; the result says so.
    /// </summary>
    /// <exception cref="ArgumentException">When the window is not inside the series (after the filter edges) or the band is unusable.</exception>
    public static MeasuredAmplitude CandidateStrain(TimeSeries strain, GpsTime arrival, double bandLowHz, double bandHighHz, double halfWindowSeconds = 0.25)
    {
        ArgumentNullException.ThrowIfNull(strain);
        var (filtered, high) = BandPass(strain, bandLowHz, bandHighHz, "strain");
        var (from, to) = Indices(strain, arrival.AddSeconds(-halfWindowSeconds), arrival.AddSeconds(halfWindowSeconds), "strain", "the arrival's window");
        var peak = 0.0;
        for (var i = from; i <= to; i++)
        {
            peak = Math.Max(peak, Math.Abs(filtered[i]));
        }

        var text = string.Create(CultureInfo.InvariantCulture,
            $"peak |h| {ScientificFormat.Format(peak, 4)} of the strain band-passed to {bandLowHz:0.#}-{high:0.#} Hz within ±{halfWindowSeconds:0.###} s of the arrival (includes detector noise)");
        return new MeasuredAmplitude(peak, text);
    }

    /// <summary>
    /// A sensor's noise amplitude: the RMS of its band-passed series outside ±<paramref name="excludeHalfWindowSeconds"/> of the
    /// arrival (the disturbance itself left out), in sensor units.
    /// </summary>
    /// <exception cref="ArgumentException">When too little data is left outside the excluded window or the band is unusable.</exception>
    public static MeasuredAmplitude SensorNoise(TimeSeries sensor, GpsTime arrival, double bandLowHz, double bandHighHz, double excludeHalfWindowSeconds = 1.0)
    {
        ArgumentNullException.ThrowIfNull(sensor);
        var (filtered, high) = BandPass(sensor, bandLowHz, bandHighHz, "sensor");
        var (from, to) = Indices(sensor, sensor.Start, sensor.End, "sensor", "the record");
        var exFrom = sensor.NearestIndex(arrival.AddSeconds(-excludeHalfWindowSeconds));
        var exTo = sensor.NearestIndex(arrival.AddSeconds(excludeHalfWindowSeconds));
        var sum = 0.0;
        var n = 0;
        for (var i = from; i <= to; i++)
        {
            if (i < exFrom || i > exTo)
            {
                sum += filtered[i] * filtered[i];
                n++;
            }
        }

        if (n < 64)
        {
            throw new ArgumentException($"sensor series: only {n} samples outside ±{excludeHalfWindowSeconds} s of the arrival; give a longer record", nameof(sensor));
        }

        var rms = Math.Sqrt(sum / n);
        if (!(rms > 0))
        {
            throw new ArgumentException("sensor series: the band-passed series is zero everywhere, so it has no noise amplitude", nameof(sensor));
        }

        var text = string.Create(CultureInfo.InvariantCulture,
            $"RMS {ScientificFormat.Format(rms, 4)} of the sensor series band-passed to {bandLowHz:0.#}-{high:0.#} Hz, {n / sensor.SampleRateHz:0.#} s outside ±{excludeHalfWindowSeconds:0.###} s of the arrival");
        return new MeasuredAmplitude(rms, text);
    }

    /// <summary>
    /// Fills the data-read amplitudes of <paramref name="typed"/>: the candidate strain amplitude of every site with strain data
    /// and the noise amplitude of every channel with sensor data, each around that site's arrival. A series that cannot be read
    /// (too short, not covering the arrival) leaves the typed number in place, and a note says so. The notes say, per site and
    /// channel, what was read.
    /// </summary>
    /// <param name="typed">Band, flag fraction and the typed fallbacks.</param>
    /// <param name="strainBySite">Strain series keyed by upper-case site code.</param>
    /// <param name="sensorByChannel">Sensor series keyed by <see cref="ChannelName.Qualified"/> (site and channel).</param>
    /// <param name="arrivalOf">The arrival (or case) time of a site.</param>
    public static (CouplingOptions Options, IReadOnlyList<string> Notes) FromData(CouplingOptions typed, IReadOnlyDictionary<string, TimeSeries> strainBySite,
        IReadOnlyDictionary<string, TimeSeries> sensorByChannel, Func<string, GpsTime> arrivalOf)
    {
        ArgumentNullException.ThrowIfNull(typed);
        ArgumentNullException.ThrowIfNull(strainBySite);
        ArgumentNullException.ThrowIfNull(sensorByChannel);
        ArgumentNullException.ThrowIfNull(arrivalOf);
        var notes = new List<string>();
        var strain = new SortedDictionary<string, double>(StringComparer.Ordinal);
        foreach (var (site, series) in strainBySite.OrderBy(kv => kv.Key, StringComparer.Ordinal))
        {
            try
            {
                var m = CandidateStrain(series, arrivalOf(site), typed.BandLowHz, typed.BandHighHz);
                strain[site] = m.Value;
                notes.Add($"coupling at {site}: candidate strain amplitude read from strain data, {m.Description}");
            }
            catch (ArgumentException ex)
            {
                notes.Add($"coupling at {site}: strain data could not be read ({UserMessage.From(ex)}); the typed amplitude is used");
            }
        }

        var noise = new SortedDictionary<string, double>(StringComparer.Ordinal);
        foreach (var (key, series) in sensorByChannel.OrderBy(kv => kv.Key, StringComparer.Ordinal))
        {
            try
            {
                var m = SensorNoise(series, arrivalOf(ChannelName.SiteOf(key)), typed.BandLowHz, typed.BandHighHz);
                noise[key] = m.Value;
                notes.Add($"coupling of {key}: sensor noise amplitude read from sensor data, {m.Description}");
            }
            catch (ArgumentException ex)
            {
                notes.Add($"coupling of {key}: sensor data could not be read ({UserMessage.From(ex)}); the typed noise amplitude is used");
            }
        }

        return (typed with { MeasuredStrainAmplitudes = strain.Count > 0 ? strain : null, MeasuredSensorNoiseAmplitudes = noise.Count > 0 ? noise : null }, notes);
    }

    private static (double[] Filtered, double HighHz) BandPass(TimeSeries series, double lowHz, double highHz, string what)
    {
        var nyquist = series.SampleRateHz / 2;
        var high = Math.Min(highHz, 0.9 * nyquist);
        if (!(lowHz > 0) || !(high > lowHz))
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{what} series at {series.SampleRateHz} Hz cannot be band-passed to {lowHz}-{highHz} Hz"), nameof(series));
        }

        var sos = SecondOrderSections.FromZpk(Butterworth.BandPass(4, lowHz, high, series.SampleRateHz));
        return (FiltFilt.Apply(sos, series.Samples), high);
    }

    private static (int From, int To) Indices(TimeSeries series, GpsTime from, GpsTime to, string what, string span)
    {
        var edge = (int)Math.Ceiling(EdgeSeconds * series.SampleRateHz);
        var a = Math.Max(series.NearestIndex(from), edge);
        var b = Math.Min(series.NearestIndex(to), series.Length - 1 - edge);
        if (a > b)
        {
            throw new ArgumentException($"{what} series {series.Start}-{series.End} does not cover {span} ({from}-{to}) beyond its first and last {EdgeSeconds} s", nameof(series));
        }

        return ((int)a, (int)b);
    }
}
