namespace EventReview.Core.Signal.Spectra;

/// <summary>Welch's averaged, windowed periodogram with a periodic Hann window.</summary>
// Welch, IEEE Trans. Audio Electroacoust. 15 (1967) 70; normalisation: Heinzel, Ruediger and Schilling (2002), eq. 24.
public static class Welch
{
    /// <summary>
    /// One-sided PSD: segments of <see cref="WelchOptions.SegmentLength"/> samples stepping by (length − overlap),
    /// as many as fit ((N − overlap) / step, floor); each windowed by the periodic Hann window w; PSD_k = mean over
    /// segments of 2 |Y_k|² / (fs S2) with S2 = Σ w², DC and Nyquist bins not doubled. With <see cref="WelchAverage.Median"/>
    /// the mean is replaced by the per-bin median divided by its bias (see <see cref="WelchAverage"/>).
    /// </summary>
    /// <param name="samples">The data (at least one segment).</param>
    /// <param name="sampleRateHz">Sample rate in Hz.</param>
    /// <param name="options">Segment length and overlap.</param>
    /// <exception cref="ArgumentOutOfRangeException">When the segment is shorter than 4 samples, longer than the data,
    /// or the overlap is not in [0, length).</exception>
    public static Psd Estimate(ReadOnlySpan<double> samples, double sampleRateHz, WelchOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        int len = options.SegmentLength;
        if (len < 4 || len > samples.Length)
        {
            throw new ArgumentOutOfRangeException(nameof(options), len, $"Segment length must be between 4 and the data length ({samples.Length}).");
        }

        int overlap = options.OverlapLength ?? (len / 2);
        if (overlap < 0 || overlap >= len)
        {
            throw new ArgumentOutOfRangeException(nameof(options), overlap, "Overlap must be at least 0 and below the segment length.");
        }

        if (!(sampleRateHz > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(sampleRateHz), sampleRateHz, "Sample rate must be positive (Hz).");
        }

        int step = len - overlap;
        int count = (samples.Length - overlap) / step;
        var w = Windows.PeriodicHann(len);
        double s2 = 0;
        foreach (var v in w)
        {
            s2 += v * v;
        }

        int bins = (len / 2) + 1;
        var acc = new double[bins];
        var perSegment = options.Average == WelchAverage.Median ? new double[count][] : null;
        var seg = new double[len];
        var re = new double[bins];
        var im = new double[bins];
        for (int s = 0; s < count; s++)
        {
            var src = samples.Slice(s * step, len);
            double mean = 0;
            if (options.RemoveMean)
            {
                foreach (var v in src)
                {
                    mean += v;
                }

                mean /= len;
            }

            for (int j = 0; j < len; j++)
            {
                seg[j] = (src[j] - mean) * w[j];
            }

            Dft.ForwardReal(seg, re, im);
            var target = perSegment is null ? acc : perSegment[s] = new double[bins];
            for (int k = 0; k < bins; k++)
            {
                target[k] += (re[k] * re[k]) + (im[k] * im[k]);
            }
        }

        if (perSegment is not null)
        {
            MedianInto(perSegment, acc);
        }

        double scale = 2.0 / (sampleRateHz * s2 * (perSegment is null ? count : 1));
        for (int k = 0; k < bins; k++)
        {
            acc[k] *= scale;
        }

        acc[0] /= 2;
        if (len % 2 == 0)
        {
            acc[bins - 1] /= 2;
        }

        return new Psd(sampleRateHz / len, acc, sampleRateHz, count);
    }

    /// <summary>Per-bin median of the segments' periodograms divided by the median bias of n χ²₂ values (see <see cref="WelchAverage.Median"/>).</summary>
    private static void MedianInto(double[][] perSegment, double[] result)
    {
        int n = perSegment.Length;
        double bias = 0;
        for (int k = 1; k <= n; k++)
        {
            bias += (k % 2 == 1 ? 1.0 : -1.0) / k;
        }

        // scipy's _median_bias sums to the odd count only: for even n it uses n - 1 terms of the same series.
        if (n % 2 == 0)
        {
            bias += 1.0 / n;
        }

        var column = new double[n];
        for (int b = 0; b < result.Length; b++)
        {
            for (int s = 0; s < n; s++)
            {
                column[s] = perSegment[s][b];
            }

            Array.Sort(column);
            double median = n % 2 == 1 ? column[n / 2] : 0.5 * (column[(n / 2) - 1] + column[n / 2]);
            result[b] = median / bias;
        }
    }
}
