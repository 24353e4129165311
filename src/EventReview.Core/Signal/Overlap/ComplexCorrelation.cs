using System.Numerics;
using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// Windowed correlation of two analytic signals: Z = Σ_{n&lt;w} conj(a[aStart+n]) b[bStart+n] (complex), and the normalised
/// envelope |Z| / sqrt(Σ|a|² Σ|b|²). For a relative shift of k samples A's window moves by −⌊k/2⌋ and B's by k − ⌊k/2⌋, so both
/// windows move symmetrically about the candidate: then |Z| is symmetric about the true shift even when the signal runs past the
/// window's ends (a fixed A window and a sliding B window would skew the envelope of a long chirp and bias its peak).
/// </summary>
internal static class ComplexCorrelation
{
    /// <summary>Prefix sums of |z|²: p[i] = Σ_{j&lt;i} (re² + im²).</summary>
    public static double[] PrefixPower(AnalyticSeries z)
    {
        var p = new double[z.Length + 1];
        for (int i = 0; i < z.Length; i++)
        {
            p[i + 1] = p[i] + (z.Real[i] * z.Real[i]) + (z.Imaginary[i] * z.Imaginary[i]);
        }

        return p;
    }

    /// <summary>Σ conj(a) b over the window (re, im).</summary>
    public static (double Re, double Im) Dot(AnalyticSeries a, int aStart, AnalyticSeries b, int bStart, int w) =>
        DotParts(a.Real, a.Imaginary, aStart, b.Real, b.Imaginary, bStart, w);

    /// <summary>How far A's window moves for a relative shift of k samples (B's moves by k minus this).</summary>
    public static int ShiftOfA(int k) => -(int)Math.Floor(k / 2.0);

    /// <summary>
    /// Z at a relative shift of k samples, A's window based at <paramref name="aBase"/> and B's at <paramref name="bBase"/>. For odd k
    /// the two windows cannot move by exactly k/2 each: the mean of the two nearest splits is taken, so the windows' midpoint stays
    /// on the candidate for every k.
    /// </summary>
    public static (double Re, double Im) At(AnalyticSeries a, int aBase, AnalyticSeries b, int bBase, int k, int w)
    {
        int sa = ShiftOfA(k);
        var z = Dot(a, aBase + sa, b, bBase + k + sa, w);
        if ((k & 1) == 0)
        {
            return z;
        }

        var other = Dot(a, aBase + sa - 1, b, bBase + k + sa - 1, w);
        return (0.5 * (z.Re + other.Re), 0.5 * (z.Im + other.Im));
    }

    /// <summary>Z(k) for k = −maxLag..maxLag into re[k + maxLag], im[k + maxLag].</summary>
    public static void Lags(AnalyticSeries a, int aBase, AnalyticSeries b, int bBase, int w, int maxLag, Span<double> re, Span<double> im)
    {
        for (int k = -maxLag; k <= maxLag; k++)
        {
            (re[k + maxLag], im[k + maxLag]) = At(a, aBase, b, bBase, k, w);
        }
    }

    /// <summary>sqrt(Σ|a|² Σ|b|²) over the two windows of shift k (for odd k, the mean over the two splits of <see cref="At"/>).</summary>
    public static double Norm(double[] prefA, int aBase, double[] prefB, int bBase, int k, int w)
    {
        double Power(double[] p, int start) => p[start + w] - p[start];
        int sa = aBase + ShiftOfA(k), sb = bBase + k + ShiftOfA(k);
        double pa = Power(prefA, sa), pb = Power(prefB, sb);
        if ((k & 1) != 0)
        {
            pa = 0.5 * (pa + Power(prefA, sa - 1));
            pb = 0.5 * (pb + Power(prefB, sb - 1));
        }

        return Math.Sqrt(pa * pb);
    }

    /// <summary>Largest normalised envelope |Z(k)| / sqrt(Σ|a|² Σ|b_k|²) over the lags, for one window pair.</summary>
    public static double MaxEnvelope(AnalyticSeries a, double[] prefA, int aBase, AnalyticSeries b, double[] prefB, int bBase, int w, int maxLag)
    {
        double best = 0;
        for (int k = -maxLag; k <= maxLag; k++)
        {
            double norm = Norm(prefA, aBase, prefB, bBase, k, w);
            if (norm > 0)
            {
                var (re, im) = At(a, aBase, b, bBase, k, w);
                best = Math.Max(best, Math.Sqrt((re * re) + (im * im)) / norm);
            }
        }

        return best;
    }

    private static (double Re, double Im) DotParts(double[] ar, double[] ai, int aStart, double[] br, double[] bi, int bStart, int w)
    {
        var xr = ar.AsSpan(aStart, w);
        var xi = ai.AsSpan(aStart, w);
        var yr = br.AsSpan(bStart, w);
        var yi = bi.AsSpan(bStart, w);
        return (Real(xr, yr) + Real(xi, yi), Real(xr, yi) - Real(xi, yr));
    }

    private static double Real(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int n = x.Length, i = 0;
        double acc = 0;
        if (Vector.IsHardwareAccelerated && n >= Vector<double>.Count * 2)
        {
            var v = Vector<double>.Zero;
            int step = Vector<double>.Count;
            for (; i <= n - step; i += step)
            {
                v += new Vector<double>(x.Slice(i, step)) * new Vector<double>(y.Slice(i, step));
            }

            acc = Vector.Sum(v);
        }

        for (; i < n; i++)
        {
            acc += x[i] * y[i];
        }

        return acc;
    }
}
