using System.Numerics;
using EventReview.Core.Signal.Filters;

namespace EventReview.Core.Tests.Signal.Filters;

public class BilinearTests
{
    [Fact]
    public void Bilinear_of_a_first_order_lowpass_matches_the_reference_zpk()
    {
        double wc = 2 * Math.PI * 10;
        var analog = new Zpk([], [new Complex(-wc, 0)], wc);
        var d = Bilinear.Transform(analog, 100);
        // ref (scipy.signal.bilinear_zpk), CHECKS.md "bilinear" row
        Assert.Single(d.Zeros);
        Assert.Equal(-1.0, d.Zeros[0].Real, 12);
        Assert.Equal(0.521885552779, d.Poles[0].Real, 12);
        Assert.Equal(0.0, d.Poles[0].Imaginary, 12);
        Assert.Equal(0.239057223611, d.Gain, 12);
        Assert.Equal(0.6951024153, FrequencyResponse.Magnitude(d, 10, 100), 10);
    }

    [Fact]
    public void Prewarped_bilinear_matches_the_analogue_response_at_the_prewarp_frequency()
    {
        double wc = 2 * Math.PI * 10;
        var analog = new Zpk([], [new Complex(-wc, 0)], wc);
        var d = Bilinear.Transform(analog, 100, prewarpHz: 10);
        // identity: pre-warping makes |H_digital(f0)| = |H_analog(f0)| = 1/sqrt(2) for a first-order low-pass at f0
        Assert.Equal(FrequencyResponse.Analog(analog, 10).Magnitude, FrequencyResponse.Magnitude(d, 10, 100), 12);
        Assert.Equal(1 / Math.Sqrt(2), FrequencyResponse.Magnitude(d, 10, 100), 12);
    }

    [Fact]
    public void Bilinear_rejects_a_prewarp_frequency_above_nyquist()
    {
        var analog = new Zpk([], [new Complex(-1, 0)], 1);
        Assert.Throws<ArgumentOutOfRangeException>(() => Bilinear.Transform(analog, 100, prewarpHz: 60));
    }
}
