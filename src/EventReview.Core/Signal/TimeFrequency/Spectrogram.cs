using EventReview.Core.Signal.Spectra;
using EventReview.Core.Time;

namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Short-time Fourier transform energy maps of whitened data.</summary>
// Allen and Rabiner, Proc. IEEE 65 (1977) 1558 (short-time Fourier analysis).
public static class Spectrogram
{
    /// <summary>
    /// Computes the map of <paramref name="whitened"/> for segment centres from <paramref name="from"/> to <paramref name="to"/>
    /// (GPS), stepping by StepSeconds; segments that do not fit inside the data are skipped. Each segment is multiplied by a
    /// periodic Hann window w, zero-padded, transformed; energy = |X_k|² / Σw² (mean 1 for unit-variance white noise).
    /// Times are relative to <paramref name="reference"/>.
    /// </summary>
    /// <exception cref="ArgumentException">When no segment fits or the band holds no frequency.</exception>
    public static TimeFrequencyMap Compute(TimeSeries whitened, GpsTime from, GpsTime to, GpsTime reference, SpectrogramOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(whitened);
        options ??= new SpectrogramOptions();
        double fs = whitened.SampleRateHz;
        int seg = Math.Max(8, (int)Math.Round(options.SegmentSeconds * fs));
        int nfft = RealFft.NextPowerOfTwo(seg * Math.Max(1, options.ZeroPadFactor));
        var fft = RealFft.For(nfft);
        var w = Windows.PeriodicHann(seg);
        double s2 = w.Sum(v => v * v);
        double df = fs / nfft;
        int k0 = Math.Max(1, (int)Math.Ceiling(options.LowHz / df));
        int k1 = Math.Min(fft.Bins - 1, (int)Math.Floor(options.HighHz / df));
        if (k1 < k0)
        {
            throw new ArgumentException("The frequency band of the map holds no FFT bin.", nameof(options));
        }

        var times = new List<double>();
        var rows = new List<double[]>();
        var buf = new double[nfft];
        var re = new double[fft.Bins];
        var im = new double[fft.Bins];
        double step = Math.Max(options.StepSeconds, 1 / fs);
        double span = to.SecondsSince(from);
        for (double t = 0; t <= span + 1e-12; t += step)
        {
            var centre = from.AddSeconds(t);
            long c = whitened.NearestIndex(centre);
            long s0 = c - (seg / 2);
            if (s0 < 0 || s0 + seg > whitened.Length)
            {
                continue;
            }

            Array.Clear(buf);
            for (int j = 0; j < seg; j++)
            {
                buf[j] = whitened.Samples[s0 + j] * w[j];
            }

            fft.Forward(buf, re, im);
            var row = new double[k1 - k0 + 1];
            for (int k = k0; k <= k1; k++)
            {
                row[k - k0] = ((re[k] * re[k]) + (im[k] * im[k])) / s2;
            }

            times.Add(whitened.TimeOf((int)c).SecondsSince(reference));
            rows.Add(row);
        }

        if (rows.Count == 0)
        {
            throw new ArgumentException("No segment of the map fits inside the data.", nameof(from));
        }

        var freqs = Enumerable.Range(k0, k1 - k0 + 1).Select(k => k * df).ToArray();
        return new TimeFrequencyMap(reference.ToString(), times.ToArray(), freqs, rows.ToArray(), fs / seg);
    }
}
