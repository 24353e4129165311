namespace EventReview.Core.Signal.Spectra;

/// <summary>Whitening: dividing the data's spectrum by the amplitude spectral density.</summary>
public static class Whitening
{
    /// <summary>
    /// Whitens <paramref name="samples"/>: multiplies by a Tukey window with <paramref name="taperSamples"/> of cosine taper at
    /// each end, zero-pads to a power of two, transforms, divides bin k by sqrt(S(f_k) fs / 2) with S linearly interpolated
    /// from <paramref name="psd"/> onto the data's frequency grid, sets the DC bin to zero, and transforms back. White
    /// noise of variance σ² (S = 2σ²/fs) comes out with unit variance away from the tapered edges.
    /// </summary>
    /// <param name="samples">The data.</param>
    /// <param name="sampleRateHz">Sample rate in Hz (must match the PSD's).</param>
    /// <param name="psd">One-sided PSD of the data's noise.</param>
    /// <param name="taperSamples">Samples of taper at each end (clamped to half the length).</param>
    /// <returns>Whitened samples (dimensionless, unit variance for stationary Gaussian noise), same length as the input.</returns>
    /// <exception cref="ArgumentException">When the sample rates differ or the PSD has a non-positive value.</exception>
    public static double[] Whiten(ReadOnlySpan<double> samples, double sampleRateHz, Psd psd, int taperSamples)
    {
        ArgumentNullException.ThrowIfNull(psd);
        if (Math.Abs(psd.SampleRateHz - sampleRateHz) > 1e-9 * sampleRateHz)
        {
            throw new ArgumentException($"PSD sample rate {psd.SampleRateHz} Hz differs from the data's {sampleRateHz} Hz.", nameof(psd));
        }

        int n = samples.Length;
        int nfft = RealFft.NextPowerOfTwo(n);
        var fft = RealFft.For(nfft);
        var buf = new double[nfft];
        samples.CopyTo(buf);
        int taper = Math.Clamp(taperSamples, 0, n / 2);
        for (int j = 0; j < taper; j++)
        {
            // Same half-cosine as Windows.Tukey, applied only where it differs from 1.
            double v = 0.5 - (0.5 * Math.Cos(Math.PI * (j + 0.5) / taper));
            buf[j] *= v;
            buf[n - 1 - j] *= v;
        }

        int bins = fft.Bins;
        var re = new double[bins];
        var im = new double[bins];
        fft.Forward(buf, re, im);
        double df = sampleRateHz / nfft;
        re[0] = 0;
        im[0] = 0;
        for (int k = 1; k < bins; k++)
        {
            double s = psd.ValueAt(k * df);
            if (!(s > 0))
            {
                throw new ArgumentException($"PSD is not positive at {k * df:F3} Hz; cannot whiten.", nameof(psd));
            }

            double g = 1.0 / Math.Sqrt(s * sampleRateHz / 2);
            re[k] *= g;
            im[k] *= g;
        }

        fft.Inverse(re, im, buf);
        return n == nfft ? buf : buf.AsSpan(0, n).ToArray();
    }
}
