using System.Numerics;

namespace EventReview.Core.Signal.Overlap;

/// <summary>Direct windowed correlation over a small range of lags, normalised per lag.</summary>
internal static class WindowCorrelation
{
    /// <summary>Prefix sums of squares: p[i] = Σ_{j&lt;i} x[j]².</summary>
    public static double[] PrefixSquares(ReadOnlySpan<double> x)
    {
        var p = new double[x.Length + 1];
        for (int i = 0; i < x.Length; i++)
        {
            p[i + 1] = p[i] + (x[i] * x[i]);
        }

        return p;
    }

    /// <summary>
    /// rho[k + L] = Σ_{n&lt;w} a[aStart+n] b[bStart+k+n] / sqrt(Σ a² · Σ b²) with both sums over the same window.
    /// </summary>
    public static void Compute(double[] a, double[] prefA, int aStart, double[] b, double[] prefB, int bStart, int w, int maxLag, Span<double> rho)
    {
        double sa = prefA[aStart + w] - prefA[aStart];
        var aw = a.AsSpan(aStart, w);
        for (int k = -maxLag; k <= maxLag; k++)
        {
            int s = bStart + k;
            double sb = prefB[s + w] - prefB[s];
            double dot = Dot(aw, b.AsSpan(s, w));
            double norm = Math.Sqrt(sa * sb);
            rho[k + maxLag] = norm > 0 ? dot / norm : 0;
        }
    }

    /// <summary>Largest |rho| over lags for one window pair.</summary>
    public static double MaxAbs(double[] a, double[] prefA, int aStart, double[] b, double[] prefB, int bStart, int w, int maxLag)
    {
        double sa = prefA[aStart + w] - prefA[aStart];
        var aw = a.AsSpan(aStart, w);
        double best = 0;
        for (int k = -maxLag; k <= maxLag; k++)
        {
            int s = bStart + k;
            double sb = prefB[s + w] - prefB[s];
            double norm = Math.Sqrt(sa * sb);
            if (norm > 0)
            {
                best = Math.Max(best, Math.Abs(Dot(aw, b.AsSpan(s, w)) / norm));
            }
        }

        return best;
    }

    private static double Dot(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
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
