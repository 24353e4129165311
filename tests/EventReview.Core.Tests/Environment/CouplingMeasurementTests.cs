using EventReview.Core.Environment;
using EventReview.Core.Signal;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Environment;

public class CouplingMeasurementTests
{
    private const double Fs = 2048;
    private static readonly GpsTime Start = GpsTime.FromSeconds(1_300_000_000m);
    private static readonly GpsTime Arrival = Start.AddSeconds(8);

    // Made-up coupling function: 1e-22 strain per sensor unit, flat over 10-1000 Hz.
    private static readonly FrequencyTable Flat = new([10, 1000], [1e-22, 1e-22]);

    [Fact]
    public void The_candidate_strain_is_the_peak_of_the_band_passed_strain_at_the_arrival()
    {
        // A 150 Hz sine-Gaussian of peak 3e-22 at the arrival on a quiet background: the band-passed peak is its amplitude.
        var strain = Series(t => 3e-22 * Math.Exp(-Math.Pow(t - 8, 2) / (2 * 0.02 * 0.02)) * Math.Cos(2 * Math.PI * 150 * (t - 8)));
        var m = CouplingMeasurement.CandidateStrain(strain, Arrival, 20, 500);
        Assert.Equal(3e-22, m.Value, 0.03e-22); // identity: a mid-band tone passes a zero-phase band-pass at unit gain (1 %)
        Assert.Contains("band-passed", m.Description, StringComparison.Ordinal);
    }

    [Fact]
    public void The_sensor_noise_is_the_band_passed_rms_away_from_the_arrival()
    {
        // A 100 Hz tone of amplitude 2 (RMS 2 / sqrt 2, identity) and a loud disturbance at the arrival that must be left out.
        var sensor = Series(t => (2 * Math.Sin(2 * Math.PI * 100 * t)) + (Math.Abs(t - 8) < 0.2 ? 500 * Math.Sin(2 * Math.PI * 80 * t) : 0));
        var m = CouplingMeasurement.SensorNoise(sensor, Arrival, 20, 500, excludeHalfWindowSeconds: 0.5);
        Assert.Equal(2 / Math.Sqrt(2), m.Value, 0.02);
    }

    [Fact]
    public void Amplitudes_read_from_data_replace_typed_ones_where_the_typed_candidate_amplitude_hid_a_coupling()
    {
        // Typed: a candidate amplitude of 1e-20 (overstated) and a sensor noise of 0.1 units (understated):
        // C x SNR x noise = 1e-22 x 20 x 0.1 = 2e-22 against 1e-20.
        var typed = new CouplingOptions(1e-20, 20, 500, DefaultSensorNoiseAmplitude: 0.1);
        var fromTyped = CouplingEstimate.Estimate(Flat, typed, "KX/env/magnetometer", 20, 100)!;
        Assert.False(fromTyped.Flagged); // 2e-22 / 1e-20 = 0.02 < 0.1: the typed numbers say "no coupling concern"
        Assert.Equal("typed", fromTyped.CandidateStrainSource);

        // The data say otherwise: the candidate's strain at KX is 3e-22 and the sensor's noise is 1.41 units.
        var strain = Series(t => 3e-22 * Math.Exp(-Math.Pow(t - 8, 2) / (2 * 0.02 * 0.02)) * Math.Cos(2 * Math.PI * 150 * (t - 8)));
        var sensor = Series(t => 2 * Math.Sin(2 * Math.PI * 100 * t));
        var (options, notes) = CouplingMeasurement.FromData(typed, new Dictionary<string, TimeSeries> { ["KX"] = strain },
            new Dictionary<string, TimeSeries> { ["KX/env/magnetometer"] = sensor }, _ => Arrival);
        var fromData = CouplingEstimate.Estimate(Flat, options, "KX/env/magnetometer", 20, 100)!;
        Assert.Equal("strain data", fromData.CandidateStrainSource);
        Assert.Equal("sensor data", fromData.SensorAmplitudeSource);
        Assert.Equal(1e-22 * 20 * Math.Sqrt(2) / 3e-22, fromData.Ratio, 0.2); // about 9.4: flagged
        Assert.True(fromData.Flagged);
        Assert.Equal(2, notes.Count);

        // Another site without strain data still uses the typed amplitude, and says so.
        var elsewhere = CouplingEstimate.Estimate(Flat, options, "MV/env/magnetometer", 20, 100)!;
        Assert.Equal("typed", elsewhere.CandidateStrainSource);
    }

    [Fact]
    public void A_series_that_does_not_cover_the_arrival_falls_back_to_the_typed_number_with_a_note()
    {
        var strain = Series(_ => 0);
        var typed = new CouplingOptions(1e-21, 20, 500, DefaultSensorNoiseAmplitude: 0.1);
        var (options, notes) = CouplingMeasurement.FromData(typed, new Dictionary<string, TimeSeries> { ["KX"] = strain },
            new Dictionary<string, TimeSeries>(), _ => Arrival.AddSeconds(100));
        Assert.Null(options.MeasuredStrainAmplitudes);
        Assert.Contains("typed amplitude is used", Assert.Single(notes), StringComparison.Ordinal);
    }

    private static TimeSeries Series(Func<double, double> f) =>
        new(Start, Fs, [.. Enumerable.Range(0, (int)(16 * Fs)).Select(i => f(i / Fs))]);
}
