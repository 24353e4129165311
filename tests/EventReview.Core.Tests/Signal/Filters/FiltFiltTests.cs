using EventReview.Core.Signal.Filters;

namespace EventReview.Core.Tests.Signal.Filters;

public class FiltFiltTests
{
    [Fact]
    public void Forward_backward_filtering_keeps_the_phase_of_an_in_band_sine()
    {
        double fs = 4096;
        var sos = SecondOrderSections.FromZpk(Butterworth.BandPass(4, 35, 350, fs));
        var x = Enumerable.Range(0, 8192).Select(n => Math.Sin(2 * Math.PI * 120 * n / fs)).ToArray();
        var y = FiltFilt.Apply(sos, x);
        double g2 = Math.Pow(FrequencyResponse.Magnitude(sos, 120, fs), 2);
        // identity: zero-phase filtering multiplies a steady sine by |H|^2 with no shift (middle part, away from edges)
        for (int n = 2000; n < 6000; n += 37)
        {
            Assert.Equal(g2 * x[n], y[n], 1e-6);
        }
    }

    [Fact]
    public void Forward_backward_filtering_of_a_constant_through_a_lowpass_has_no_edge_transient()
    {
        var sos = SecondOrderSections.FromZpk(Butterworth.LowPass(4, 50, 1000));
        var x = Enumerable.Repeat(3.0, 500).ToArray();
        var y = FiltFilt.Apply(sos, x);
        // identity: steady-state initial conditions make a constant pass unchanged through a unit-DC-gain filter
        Assert.All(y, v => Assert.Equal(3.0, v, 1e-9));
    }

    [Fact]
    public void Notch_removes_its_line_and_passes_distant_frequencies()
    {
        double fs = 4096;
        var notch = Notch.Design(60, 30, fs);
        // textbook: zeros on the unit circle at f0, unit gain at DC, -3 dB at f0 +- f0/(2Q)
        Assert.Equal(0, FrequencyResponse.Magnitude(notch, 60, fs), 12);
        Assert.Equal(1, FrequencyResponse.Magnitude(notch, 0, fs), 12);
        Assert.Equal(1, FrequencyResponse.Magnitude(notch, 1000, fs), 2);
        var sos = SecondOrderSections.FromZpk(notch);
        var x = Enumerable.Range(0, 16384).Select(n => Math.Sin(2 * Math.PI * 60 * n / fs)).ToArray();
        var y = FiltFilt.Apply(sos, x);
        // the notch transient (time constant ~ Q / (pi f0) = 0.16 s) has decayed by sample 6000
        Assert.True(y.Skip(6000).Take(4000).Max(Math.Abs) < 1e-3);
    }
}
