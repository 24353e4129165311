using System.Numerics;
using MathNet.Numerics.IntegralTransforms;

namespace EventReview.Core.Signal.Spectra;

/// <summary>
/// One-sided real DFT of any length: the plan-based <see cref="RealFft"/> for powers of two, MathNet.Numerics
/// Fourier.Forward (FourierOptions.NoScaling, so X[k] = Σ x[j] e^{−2πijk/n}) for other lengths.
/// </summary>
public static class Dft
{
    /// <summary>Forward transform of x (length n) into n/2 + 1 bins (floor), unscaled.</summary>
    public static void ForwardReal(ReadOnlySpan<double> x, Span<double> re, Span<double> im)
    {
        int n = x.Length;
        if (n >= 4 && (n & (n - 1)) == 0)
        {
            RealFft.For(n).Forward(x, re, im);
            return;
        }

        var c = new Complex[n];
        for (int i = 0; i < n; i++)
        {
            c[i] = new Complex(x[i], 0);
        }

        Fourier.Forward(c, FourierOptions.NoScaling);
        for (int k = 0; k <= n / 2; k++)
        {
            re[k] = c[k].Real;
            im[k] = c[k].Imaginary;
        }
    }
}
