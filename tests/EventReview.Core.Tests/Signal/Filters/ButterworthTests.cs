using EventReview.Core.Signal.Filters;

namespace EventReview.Core.Tests.Signal.Filters;

public class ButterworthTests
{
    private static readonly Zpk BandPass = Butterworth.BandPass(4, 35, 350, 4096);

    [Fact]
    public void Fourth_order_bandpass_has_the_reference_gain_and_response()
    {
        // ref (scipy.signal.butter(4, [35, 350], 'bandpass', fs=4096, output='zpk')), CHECKS.md "Butterworth" row
        Assert.Equal(8, BandPass.Poles.Count);
        Assert.Equal(1.946649074134e-3, BandPass.Gain, 1e-9);
        Assert.Equal(0.7071067812, FrequencyResponse.Magnitude(BandPass, 35, 4096), 1e-9);
        Assert.Equal(0.7071067812, FrequencyResponse.Magnitude(BandPass, 350, 4096), 1e-9);
        Assert.Equal(0.0045583643, FrequencyResponse.Magnitude(BandPass, 10, 4096), 1e-9);
        Assert.Equal(0.0045424200, FrequencyResponse.Magnitude(BandPass, 1000, 4096), 1e-9);
    }

    [Fact]
    public void Second_order_sections_reproduce_the_zpk_response()
    {
        var sos = SecondOrderSections.FromZpk(BandPass);
        Assert.Equal(4, sos.Length);
        foreach (var f in new[] { 5.0, 35, 100, 350, 1000, 2000 })
        {
            // identity: the cascade is the same rational function
            Assert.Equal(FrequencyResponse.Magnitude(BandPass, f, 4096), FrequencyResponse.Magnitude(sos, f, 4096), 1e-10);
        }
    }

    [Fact]
    public void Lowpass_and_highpass_are_three_db_down_at_the_cutoff()
    {
        var lp = Butterworth.LowPass(6, 100, 1000);
        var hp = Butterworth.HighPass(5, 100, 1000);
        // textbook: a Butterworth filter is 1/sqrt(2) at its cut-off, 1 at DC (low-pass) or Nyquist (high-pass)
        Assert.Equal(1 / Math.Sqrt(2), FrequencyResponse.Magnitude(lp, 100, 1000), 10);
        Assert.Equal(1.0, FrequencyResponse.Magnitude(lp, 0, 1000), 10);
        Assert.Equal(1 / Math.Sqrt(2), FrequencyResponse.Magnitude(hp, 100, 1000), 10);
        Assert.Equal(1.0, FrequencyResponse.Magnitude(hp, 500, 1000), 10);
    }
}
