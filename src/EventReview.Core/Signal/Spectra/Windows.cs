namespace EventReview.Core.Signal.Spectra;

/// <summary>Window functions used by the spectral estimators.</summary>
public static class Windows
{
    /// <summary>Periodic Hann window of length n: w[j] = 0.5 − 0.5 cos(2πj/n) (the DFT-even form; NENBW exactly 1.5 bins).</summary>
    // Harris, Proc. IEEE 66 (1978) 51; periodic form as in Heinzel, Ruediger and Schilling (2002), section 8.
    public static double[] PeriodicHann(int n)
    {
        if (n < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(n), n, "Window length must be at least 1.");
        }

        var w = new double[n];
        for (int j = 0; j < n; j++)
        {
            w[j] = 0.5 - (0.5 * Math.Cos(2 * Math.PI * j / n));
        }

        return w;
    }

    /// <summary>
    /// Tukey (tapered cosine) window of length n with <paramref name="taperSamples"/> samples of half-cosine rise at each
    /// end and 1 in between. taperSamples = 0 gives a rectangular window.
    /// </summary>
    public static double[] Tukey(int n, int taperSamples)
    {
        if (n < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(n), n, "Window length must be at least 1.");
        }

        taperSamples = Math.Clamp(taperSamples, 0, n / 2);
        var w = new double[n];
        Array.Fill(w, 1.0);
        for (int j = 0; j < taperSamples; j++)
        {
            double v = 0.5 - (0.5 * Math.Cos(Math.PI * (j + 0.5) / taperSamples));
            w[j] = v;
            w[n - 1 - j] = v;
        }

        return w;
    }
}
