using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Signal;

/// <summary>Optimal (noise-free) matched-filter signal-to-noise ratio of a known waveform.</summary>
public static class SignalToNoise
{
    /// <summary>
    /// ρ = sqrt(4 Σ_k |h̃(f_k)|² / S(f_k) Δf) over lowHz ≤ f_k &lt; fs/2, with h̃ = Δt · DFT(h) on an N-point grid
    /// (N the next power of two, zero-padded), S = asd², Δf = fs / N. Dimensionless.
    /// </summary>
    /// <param name="signal">The waveform (strain).</param>
    /// <param name="sampleRateHz">Sample rate, Hz.</param>
    /// <param name="asdPerRtHz">Noise ASD (strain/√Hz) as a function of frequency (Hz).</param>
    /// <param name="lowHz">Lowest frequency included, Hz.</param>
    // e.g. Finn, Phys. Rev. D 46 (1992) 5236, the noise-weighted inner product.
    public static double Optimal(ReadOnlySpan<double> signal, double sampleRateHz, Func<double, double> asdPerRtHz, double lowHz)
    {
        ArgumentNullException.ThrowIfNull(asdPerRtHz);
        int n = RealFft.NextPowerOfTwo(signal.Length);
        var buf = new double[n];
        signal.CopyTo(buf);
        var fft = RealFft.For(n);
        var re = new double[fft.Bins];
        var im = new double[fft.Bins];
        fft.Forward(buf, re, im);
        double dt = 1 / sampleRateHz, df = sampleRateHz / n, sum = 0;
        for (int k = 1; k < fft.Bins - 1; k++)
        {
            double f = k * df;
            if (f < lowHz)
            {
                continue;
            }

            double a = asdPerRtHz(f);
            sum += ((re[k] * re[k]) + (im[k] * im[k])) * dt * dt / (a * a);
        }

        return Math.Sqrt(4 * sum * df);
    }
}
