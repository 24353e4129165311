using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Chain;

/// <summary>
/// How much of the residual the stage's input explains linearly: the magnitude-squared coherence
/// C(f) = |S_xy|^2 / (S_xx S_yy) between input x and residual y, from Welch averages (periodic Hann, 50 % overlap, segment
/// means removed; Carter 1987, Proc. IEEE 75, 236), and the coherent fraction sum C(f) S_yy(f) / sum S_yy(f) over the
/// non-zero frequencies: the share of the residual's power a linear filter of the input could remove. A correct model
/// leaves a residual incoherent with the input (C near its bias 1/K for K segments); a wrong gain, pole or delay leaves
/// a residual that is mostly a filtered copy of the input (C near 1).
/// </summary>
internal static class ChainCoherence
{
    /// <summary>Fewest segments for a usable estimate (bias 1/K of the coherence of unrelated series stays below ~0.1).</summary>
    public const int MinSegments = 8;

    /// <summary>Estimates over x[from..from+count) and y[from..from+count).</summary>
    /// <returns>The coherent fraction, the largest C(f), and the number of segments averaged.</returns>
    public static (double Fraction, double Max, int Segments) Estimate(double[] x, double[] y, int from, int count)
    {
        var length = 32;
        while (length * 2 <= Math.Min(1024, count / MinSegments))
        {
            length *= 2;
        }

        var step = length / 2;
        var segments = count >= length ? ((count - length) / step) + 1 : 0;
        if (segments < MinSegments)
        {
            return (double.NaN, double.NaN, segments);
        }

        var fft = RealFft.For(length);
        var w = Windows.PeriodicHann(length);
        var bins = fft.Bins;
        var sxx = new double[bins];
        var syy = new double[bins];
        var sxyRe = new double[bins];
        var sxyIm = new double[bins];
        var bx = new double[length];
        var by = new double[length];
        var (xr, xi, yr, yi) = (new double[bins], new double[bins], new double[bins], new double[bins]);
        for (var s = 0; s < segments; s++)
        {
            Window(x, from + (s * step), w, bx);
            Window(y, from + (s * step), w, by);
            fft.Forward(bx, xr, xi);
            fft.Forward(by, yr, yi);
            for (var k = 1; k < bins; k++)
            {
                sxx[k] += (xr[k] * xr[k]) + (xi[k] * xi[k]);
                syy[k] += (yr[k] * yr[k]) + (yi[k] * yi[k]);

                // conj(X) Y
                sxyRe[k] += (xr[k] * yr[k]) + (xi[k] * yi[k]);
                sxyIm[k] += (xr[k] * yi[k]) - (xi[k] * yr[k]);
            }
        }

        double explained = 0, total = 0, max = 0;
        for (var k = 1; k < bins; k++)
        {
            var c = sxx[k] > 0 && syy[k] > 0 ? ((sxyRe[k] * sxyRe[k]) + (sxyIm[k] * sxyIm[k])) / (sxx[k] * syy[k]) : 0;
            explained += c * syy[k];
            total += syy[k];
            max = Math.Max(max, c);
        }

        return (total > 0 ? explained / total : 0, max, segments);
    }

    private static void Window(double[] source, int start, double[] w, double[] target)
    {
        var mean = 0.0;
        for (var i = 0; i < w.Length; i++)
        {
            mean += source[start + i];
        }

        mean /= w.Length;
        for (var i = 0; i < w.Length; i++)
        {
            target[i] = (source[start + i] - mean) * w[i];
        }
    }
}
