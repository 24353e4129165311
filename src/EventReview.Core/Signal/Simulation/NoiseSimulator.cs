using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Signal.Simulation;

/// <summary>Stationary coloured Gaussian noise generated in the frequency domain.</summary>
public static class NoiseSimulator
{
    /// <summary>
    /// Draws <paramref name="count"/> samples of Gaussian noise whose one-sided PSD is asd(f)²: bins k = 1..N/2 − 1 of an
    /// N-point spectrum (N the next power of two) get independent real and imaginary parts of variance N S(f_k) fs / 4,
    /// DC is zero, Nyquist real with variance N S fs / 2; then the inverse FFT, keeping the first <paramref name="count"/> samples.
    /// Deterministic for a given <paramref name="random"/> state (draws in bin order, Box-Muller).
    /// </summary>
    /// <param name="asdPerRtHz">ASD in unit/√Hz as a function of frequency in Hz.</param>
    /// <param name="sampleRateHz">Sample rate in Hz.</param>
    /// <param name="count">Number of samples (≥ 4).</param>
    /// <param name="random">Random source (e.g. new Random(seed)).</param>
    public static double[] Generate(Func<double, double> asdPerRtHz, double sampleRateHz, int count, Random random)
    {
        ArgumentNullException.ThrowIfNull(asdPerRtHz);
        ArgumentNullException.ThrowIfNull(random);
        if (count < 4)
        {
            throw new ArgumentOutOfRangeException(nameof(count), count, "At least 4 samples are needed.");
        }

        int n = RealFft.NextPowerOfTwo(count);
        var fft = RealFft.For(n);
        var re = new double[fft.Bins];
        var im = new double[fft.Bins];
        double df = sampleRateHz / n;
        for (int k = 1; k < fft.Bins; k++)
        {
            double s = Math.Pow(asdPerRtHz(k * df), 2);
            bool nyquist = k == fft.Bins - 1;
            double sd = Math.Sqrt(n * s * sampleRateHz / (nyquist ? 2 : 4));
            re[k] = sd * Gaussian(random);
            im[k] = nyquist ? 0 : sd * Gaussian(random);
        }

        var x = new double[n];
        fft.Inverse(re, im, x);
        return x.AsSpan(0, count).ToArray();
    }

    /// <summary>A standard normal deviate by the Box-Muller transform.</summary>
    // Box and Muller, Ann. Math. Stat. 29 (1958) 610.
    public static double Gaussian(Random random)
    {
        ArgumentNullException.ThrowIfNull(random);
        double u1 = 1.0 - random.NextDouble(), u2 = random.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }
}
