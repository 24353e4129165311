using EventReview.Core.Environment;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Environment;

public class CouplingEstimateTests
{
    // Made-up coupling function: a power law C(f) = 1e-18 (f / 1 Hz)^-2 strain per sensor unit, tabulated at 10, 100, 1000 Hz.
    private static readonly FrequencyTable Coupling = new([10, 100, 1000], [1e-20, 1e-22, 1e-24]);

    [Fact]
    public void Log_log_interpolation_reproduces_a_power_law_between_points()
    {
        Assert.Equal(1e-18 / (31.6227766 * 31.6227766), Coupling.At(31.6227766)!.Value, 1e-30);
        Assert.Null(Coupling.At(5));
    }

    [Fact]
    public void Snr_times_noise_model_uses_the_trigger_frequency_inside_the_band()
    {
        var options = new CouplingOptions(CandidateStrainAmplitude: 1e-21, BandLowHz: 20, BandHighHz: 500, DefaultSensorNoiseAmplitude: 0.5);
        var r = CouplingEstimate.Estimate(Coupling, options, "KX/env/microphone", snr: 20, frequencyHz: 50)!;
        // strain = C(50 Hz) x SNR x noise = 4e-22 x 20 x 0.5 = 4e-21
        Assert.Equal(4e-21, r.StrainEstimate, 1e-33);
        Assert.Equal(4.0, r.Ratio, 1e-9);
        Assert.True(r.Flagged);
        Assert.Equal("snr-x-noise", r.Method);
    }

    [Fact]
    public void Without_a_trigger_frequency_the_largest_coupling_in_the_band_is_used_and_small_ratios_pass()
    {
        var options = new CouplingOptions(1e-21, 20, 500, DefaultSensorNoiseAmplitude: 1e-3);
        var r = CouplingEstimate.Estimate(Coupling, options, "KX/env/microphone", snr: 10, frequencyHz: null)!;
        // Largest C in 20-500 Hz is at 20 Hz: 2.5e-21; x 10 x 1e-3 = 2.5e-23, ratio 0.025 < 0.1 (common-practice margin)
        Assert.Equal(20, r.FrequencyHz);
        Assert.Equal(0.025, r.Ratio, 1e-9);
        Assert.False(r.Flagged);
    }

    [Fact]
    public void A_measured_sensor_spectrum_replaces_the_snr_model()
    {
        var spectrum = new FrequencyTable([10, 1000], [1.0, 1e4]); // amplitude grows as f^2: product is flat at 1e-20
        var options = new CouplingOptions(1e-19, 20, 500, SensorAmplitudeSpectra: new Dictionary<string, FrequencyTable> { ["KX/env/microphone"] = spectrum });
        var r = CouplingEstimate.Estimate(Coupling, options, "KX/env/microphone", snr: 1000, frequencyHz: 50)!;
        Assert.Equal(1e-20, r.StrainEstimate, 1e-30);
        Assert.Equal(0.1, r.Ratio, 1e-9);
        Assert.True(r.Flagged); // exactly at the 10 % margin counts
        Assert.Equal("spectrum", r.Method);
    }

    [Fact]
    public void No_noise_amplitude_means_no_estimate()
    {
        Assert.Null(CouplingEstimate.Estimate(Coupling, new CouplingOptions(1e-21, 20, 500), "KX/env/microphone", 10, 50));
    }

    [Fact]
    public void The_lookup_reports_the_coupling_ratio_of_a_hit()
    {
        var t = GpsTime.FromSeconds(1000m);
        var input = new EnvironmentLookupInput(t, new Dictionary<string, GpsTime>(), ["KX"], [],
            [new AuxiliaryTrigger("KX", "env/microphone", t.AddSeconds(0.1), 20, 50, null)],
            [new Sensor("KX", "env/microphone", SensorKind.Acoustic, "hall", "mic.csv")],
            CouplingFunctions: new Dictionary<string, FrequencyTable> { ["KX/env/microphone"] = Coupling });
        var options = new EnvironmentLookupOptions(Coupling: new CouplingOptions(1e-21, 20, 500, DefaultSensorNoiseAmplitude: 0.5));
        var hit = Assert.Single(EnvironmentLookup.Run(input, options).Hits);
        Assert.Equal(4.0, hit.CouplingRatio!.Value, 1e-9);
        Assert.True(hit.CouplingFlagged);
    }
}
