using System.Numerics;
using EventReview.Core.Signal.Spectra;
using EventReview.Core.Time;
using MathNet.Numerics.IntegralTransforms;

namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>
/// The multi-resolution Q transform of whitened data (Chatterji et al. 2004, Class. Quantum Grav. 21 S1809): for every tile of
/// <see cref="QTiling"/> the data's spectrum is multiplied by a bisquare window (1 − (ν/Δ)²)², Δ = f √11 / Q, centred on the tile's
/// frequency, and brought back to time by an inverse FFT of the row's tile count; the tile energy is |coefficient|². Each row's
/// energies are divided by their median ("power / median": white Gaussian noise then gives exponentially distributed values of
/// median 1 and mean 1 / ln 2). A display map takes, at every time and log-spaced frequency, the largest value over the Q planes.
/// </summary>
public static class QTransform
{
    /// <summary>
    /// Transforms the whitened series over [<paramref name="from"/>, <paramref name="to"/>] (GPS), analysing PadSeconds more on each
    /// side (a power-of-two segment), and returns the display map with times relative to <paramref name="reference"/>.
    /// </summary>
    /// <param name="whitened">Whitened (and band-passed) data.</param>
    /// <param name="from">Start of the mapped span.</param>
    /// <param name="to">End of the mapped span.</param>
    /// <param name="reference">Time that the map's times are measured from.</param>
    /// <param name="options">Tiling settings.</param>
    /// <param name="columns">Display columns across the span (default 240).</param>
    /// <param name="rows">Display rows, log-spaced in frequency (default 120).</param>
    /// <exception cref="ArgumentException">When the span does not lie inside the data or the settings are out of range.</exception>
    public static QMap Compute(TimeSeries whitened, GpsTime from, GpsTime to, GpsTime reference, QTransformOptions? options = null, int columns = 240, int rows = 120)
    {
        ArgumentNullException.ThrowIfNull(whitened);
        options ??= new QTransformOptions();
        double fs = whitened.SampleRateHz;
        double span = to.SecondsSince(from);
        if (!(span > 0) || columns < 2 || rows < 2)
        {
            throw new ArgumentException("The mapped span must be positive and the display at least 2 × 2.", nameof(to));
        }

        int n = RealFft.NextPowerOfTwo((int)Math.Ceiling((span + (2 * options.PadSeconds)) * fs));
        n = Math.Min(n, LargestPowerOfTwo(whitened.Length));
        long startIndex = whitened.NearestIndex(from.AddSeconds(span / 2)) - (n / 2);
        startIndex = Math.Clamp(startIndex, 0, whitened.Length - n);
        var segmentStart = whitened.TimeOf((int)startIndex);
        if (from.SecondsSince(segmentStart) < 0 || segmentStart.AddSeconds(n / fs).SecondsSince(to) < 0)
        {
            throw new ArgumentException($"The span {from}–{to} does not fit inside the data ({whitened.Start}–{whitened.End}).", nameof(from));
        }

        double seconds = n / fs;
        var planes = QTiling.Planes(options, seconds, fs);
        var fft = RealFft.For(n);
        var re = new double[fft.Bins];
        var im = new double[fft.Bins];
        fft.Forward(whitened.Samples.AsSpan((int)startIndex, n), re, im);

        double fLo = planes.Min(p => p.Rows[0].FrequencyHz), fHi = planes.Max(p => p.Rows[^1].FrequencyHz);
        var times = Enumerable.Range(0, columns).Select(i => (span * (i + 0.5) / columns) + from.SecondsSince(reference)).ToArray();
        var freqs = Enumerable.Range(0, rows).Select(j => fLo * Math.Pow(fHi / fLo, j / (double)(rows - 1))).ToArray();
        var energy = times.Select(_ => new double[rows]).ToArray();
        var bestQ = times.Select(_ => new double[rows]).ToArray();
        double offset = segmentStart.SecondsSince(reference);
        foreach (var plane in planes)
        {
            var rowEnergies = plane.Rows.Select(r => RowEnergy(re, im, r, seconds)).ToArray();
            for (int j = 0; j < rows; j++)
            {
                int nearest = NearestRow(plane, freqs[j]);
                if (nearest < 0)
                {
                    continue;
                }

                var e = rowEnergies[nearest];
                for (int i = 0; i < columns; i++)
                {
                    int m = (int)Math.Round((times[i] - offset) / seconds * e.Length);
                    double v = e[((m % e.Length) + e.Length) % e.Length];
                    if (v > energy[i][j])
                    {
                        energy[i][j] = v;
                        bestQ[i][j] = plane.Q;
                    }
                }
            }
        }

        return new QMap(reference.ToString(), times, freqs, energy, bestQ, planes.Select(p => p.Q).ToArray(), options.MaxMismatch);
    }

    /// <summary>Energies (power / median) of one row's tiles across the segment, tile m at time m T / count from the segment's start.</summary>
    internal static double[] RowEnergy(double[] re, double[] im, QRow row, double seconds)
    {
        double f = row.FrequencyHz, half = row.HalfBandwidthHz;
        int k0 = Math.Max(1, (int)Math.Ceiling((f - half) * seconds)), k1 = Math.Min(re.Length - 2, (int)Math.Floor((f + half) * seconds));
        int count = row.TileCount;
        while (count < k1 - k0 + 1)
        {
            count <<= 1;
        }

        var c = new Complex[count];
        int centre = (int)Math.Round(f * seconds);
        for (int k = k0; k <= k1; k++)
        {
            double x = ((k / seconds) - f) / half;
            double w = (1 - (x * x)) * (1 - (x * x));
            c[(((k - centre) % count) + count) % count] = new Complex(re[k] * w, im[k] * w);
        }

        Fourier.Inverse(c, FourierOptions.NoScaling);
        var e = new double[count];
        for (int m = 0; m < count; m++)
        {
            e[m] = (c[m].Real * c[m].Real) + (c[m].Imaginary * c[m].Imaginary);
        }

        var sorted = (double[])e.Clone();
        Array.Sort(sorted);
        double median = count % 2 == 1 ? sorted[count / 2] : 0.5 * (sorted[(count / 2) - 1] + sorted[count / 2]);
        if (median > 0)
        {
            for (int m = 0; m < count; m++)
            {
                e[m] /= median;
            }
        }

        return e;
    }

    private static int NearestRow(QPlane plane, double f)
    {
        var first = plane.Rows[0];
        var last = plane.Rows[^1];
        if (f < first.FrequencyHz - first.HalfBandwidthHz / 2 || f > last.FrequencyHz + last.HalfBandwidthHz / 2)
        {
            return -1;
        }

        int best = 0;
        for (int r = 1; r < plane.Rows.Count; r++)
        {
            best = Math.Abs(Math.Log(plane.Rows[r].FrequencyHz / f)) < Math.Abs(Math.Log(plane.Rows[best].FrequencyHz / f)) ? r : best;
        }

        return best;
    }

    private static int LargestPowerOfTwo(int n)
    {
        int p = 1;
        while (p * 2 <= n)
        {
            p *= 2;
        }

        return p;
    }
}
