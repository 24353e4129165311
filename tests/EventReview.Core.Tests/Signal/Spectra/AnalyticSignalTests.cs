using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Tests.Signal.Spectra;

public class AnalyticSignalTests
{
    [Fact]
    public void The_hilbert_transform_of_a_cosine_is_the_sine_and_of_a_sine_minus_the_cosine()
    {
        // Textbook identities (Bracewell, ch. 12) for whole cycles in a power-of-two record.
        const int n = 1024;
        var cos = Enumerable.Range(0, n).Select(i => Math.Cos(2 * Math.PI * 37 * i / n)).ToArray();
        var sin = Enumerable.Range(0, n).Select(i => Math.Sin(2 * Math.PI * 37 * i / n)).ToArray();

        var zc = AnalyticSignal.Of(cos);
        var zs = AnalyticSignal.Of(sin);

        for (int i = 0; i < n; i++)
        {
            Assert.Equal(sin[i], zc.Imaginary[i], 1e-12);
            Assert.Equal(-cos[i], zs.Imaginary[i], 1e-12);
            Assert.Equal(cos[i], zc.Real[i], 0);
        }
    }

    [Fact]
    public void The_envelope_of_a_modulated_tone_is_its_modulation()
    {
        const int n = 4096;
        double Envelope(int i) => Math.Exp(-Math.Pow((i - 2048) / 300.0, 2));
        var x = Enumerable.Range(0, n).Select(i => Envelope(i) * Math.Cos((2 * Math.PI * 400 * i / n) + 0.7)).ToArray();

        var z = AnalyticSignal.Of(x);

        // Bedrosian: a slow envelope times a fast carrier; identity to the envelope's spectral leakage (~1e-6 here).
        for (int i = 1000; i < 3000; i += 37)
        {
            Assert.Equal(Envelope(i), Math.Sqrt((z.Real[i] * z.Real[i]) + (z.Imaginary[i] * z.Imaginary[i])), 1e-6);
        }
    }
}
