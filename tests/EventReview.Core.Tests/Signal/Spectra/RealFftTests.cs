using System.Numerics;
using EventReview.Core.Signal.Spectra;
using MathNet.Numerics.IntegralTransforms;

namespace EventReview.Core.Tests.Signal.Spectra;

public class RealFftTests
{
    [Theory]
    [InlineData(8)]
    [InlineData(1024)]
    [InlineData(65536)]
    public void Forward_transform_agrees_with_mathnet_and_inverse_round_trips(int n)
    {
        var rng = new Random(n);
        var x = Enumerable.Range(0, n).Select(_ => rng.NextDouble() - 0.5).ToArray();
        var c = x.Select(v => new Complex(v, 0)).ToArray();
        // oracle: MathNet.Numerics Fourier.Forward with NoScaling
        Fourier.Forward(c, FourierOptions.NoScaling);
        var plan = RealFft.For(n);
        var re = new double[plan.Bins];
        var im = new double[plan.Bins];
        plan.Forward(x, re, im);
        for (int k = 0; k <= n / 2; k++)
        {
            Assert.Equal(c[k].Real, re[k], 1e-9);
            Assert.Equal(c[k].Imaginary, im[k], 1e-9);
        }

        var back = new double[n];
        plan.Inverse(re, im, back);
        for (int i = 0; i < n; i++)
        {
            Assert.Equal(x[i], back[i], 1e-12);
        }
    }
}
