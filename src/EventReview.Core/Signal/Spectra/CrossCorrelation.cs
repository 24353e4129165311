namespace EventReview.Core.Signal.Spectra;

/// <summary>Normalised cross-correlation of two finite sequences.</summary>
public static class CrossCorrelation
{
    /// <summary>
    /// ρ(k) = Σ_n x[n] y[n + k] / sqrt(Σ x² Σ y²) for k = −maxLag..maxLag, samples outside either sequence taken as zero.
    /// Element i of the result is lag k = i − maxLag. A positive best lag means y is x delayed by k samples.
    /// All zeros (not NaN) when either sequence is all zero.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">When maxLag is negative.</exception>
    public static double[] Normalised(ReadOnlySpan<double> x, ReadOnlySpan<double> y, int maxLag)
    {
        if (maxLag < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(maxLag), maxLag, "Maximum lag must not be negative (samples).");
        }

        double sx = 0, sy = 0;
        foreach (var v in x)
        {
            sx += v * v;
        }

        foreach (var v in y)
        {
            sy += v * v;
        }

        double norm = Math.Sqrt(sx * sy);
        var rho = new double[(2 * maxLag) + 1];
        for (int k = -maxLag; k <= maxLag; k++)
        {
            int n0 = Math.Max(0, -k), n1 = Math.Min(x.Length, y.Length - k);
            double acc = 0;
            for (int n = n0; n < n1; n++)
            {
                acc += x[n] * y[n + k];
            }

            rho[k + maxLag] = norm > 0 ? acc / norm : 0;
        }

        return rho;
    }

    /// <summary>The lag (samples, −maxLag..maxLag) of the largest |ρ| and ρ there (first one on ties).</summary>
    public static (int Lag, double Rho) Best(IReadOnlyList<double> rho)
    {
        ArgumentNullException.ThrowIfNull(rho);
        int maxLag = (rho.Count - 1) / 2;
        int best = 0;
        for (int i = 1; i < rho.Count; i++)
        {
            if (Math.Abs(rho[i]) > Math.Abs(rho[best]))
            {
                best = i;
            }
        }

        return (best - maxLag, rho[best]);
    }
}
