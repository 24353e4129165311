namespace EventReview.Core.Signal.Spectra;

/// <summary>
/// The analytic signal x + i H(x) of a real series by FFT: H multiplies bin k &gt; 0 by −i (the Hilbert transform; Bracewell,
/// "The Fourier Transform and Its Applications", ch. 12), DC and Nyquist bins of H are zero. The series is zero-padded to a power
/// of two, so values within a few cycles of either end are unreliable unless the series is tapered there.
/// </summary>
public static class AnalyticSignal
{
    /// <summary>Computes the analytic signal of <paramref name="samples"/>.</summary>
    /// <exception cref="ArgumentException">When fewer than 4 samples are given.</exception>
    public static AnalyticSeries Of(ReadOnlySpan<double> samples)
    {
        if (samples.Length < 4)
        {
            throw new ArgumentException("At least 4 samples are needed for an analytic signal.", nameof(samples));
        }

        int n = samples.Length;
        int nfft = RealFft.NextPowerOfTwo(n);
        var fft = RealFft.For(nfft);
        var buf = new double[nfft];
        samples.CopyTo(buf);
        int bins = fft.Bins;
        var re = new double[bins];
        var im = new double[bins];
        fft.Forward(buf, re, im);
        var hr = new double[bins];
        var hi = new double[bins];
        for (int k = 1; k < bins - 1; k++)
        {
            (hr[k], hi[k]) = (im[k], -re[k]);
        }

        fft.Inverse(hr, hi, buf);
        return new AnalyticSeries(samples.ToArray(), n == nfft ? buf : buf.AsSpan(0, n).ToArray());
    }
}
