using System.Numerics;

namespace EventReview.Core.Signal.Filters;

/// <summary>Maps an analogue filter to a digital one by the bilinear transform s = K (z − 1)/(z + 1).</summary>
public static class Bilinear
{
    /// <summary>
    /// Transforms an analogue ZPK (rad/s) into a digital ZPK (z-plane). Without pre-warping K = 2 fs, as in the
    /// usual reference implementation; with a pre-warp frequency f0 (Hz) K = 2π f0 / tan(π f0 / fs) so that the
    /// analogue and digital responses agree exactly at f0. Zeros at infinity (relative degree) map to z = −1.
    /// The digital gain is Gain · Re(Π(K − z) / Π(K − p)).
    /// </summary>
    /// <param name="analog">Analogue filter, zeros and poles in rad/s.</param>
    /// <param name="sampleRateHz">Sampling frequency in Hz (> 0).</param>
    /// <param name="prewarpHz">Optional frequency in Hz, 0 &lt; f0 &lt; fs/2, where the responses are matched.</param>
    /// <exception cref="ArgumentOutOfRangeException">When the sample rate or pre-warp frequency is out of range,
    /// or the filter has more zeros than poles.</exception>
    // Bilinear transform: Oppenheim and Schafer, "Discrete-Time Signal Processing", 3rd ed., section 7.2.
    public static Zpk Transform(Zpk analog, double sampleRateHz, double? prewarpHz = null)
    {
        ArgumentNullException.ThrowIfNull(analog);
        if (!(sampleRateHz > 0) || !double.IsFinite(sampleRateHz))
        {
            throw new ArgumentOutOfRangeException(nameof(sampleRateHz), sampleRateHz, "Sample rate must be a positive finite number of Hz.");
        }

        if (analog.RelativeDegree < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(analog), analog.RelativeDegree, "An analogue filter must have at least as many poles as zeros.");
        }

        double k = 2.0 * sampleRateHz;
        if (prewarpHz is { } f0)
        {
            if (!(f0 > 0) || !(f0 < sampleRateHz / 2))
            {
                throw new ArgumentOutOfRangeException(nameof(prewarpHz), f0, "Pre-warp frequency must be between 0 and the Nyquist frequency (Hz).");
            }

            k = 2.0 * Math.PI * f0 / Math.Tan(Math.PI * f0 / sampleRateHz);
        }

        var zeros = new List<Complex>(analog.Poles.Count);
        var poles = new List<Complex>(analog.Poles.Count);
        Complex num = Complex.One, den = Complex.One;
        foreach (var z in analog.Zeros)
        {
            zeros.Add((k + z) / (k - z));
            num *= k - z;
        }

        foreach (var p in analog.Poles)
        {
            poles.Add((k + p) / (k - p));
            den *= k - p;
        }

        for (int i = 0; i < analog.RelativeDegree; i++)
        {
            zeros.Add(-Complex.One);
        }

        return new Zpk(zeros, poles, analog.Gain * (num / den).Real);
    }

    /// <summary>Pre-warped analogue angular frequency (rad/s) for a digital frequency f (Hz): 2 fs tan(π f / fs).</summary>
    public static double PrewarpRadPerSecond(double frequencyHz, double sampleRateHz)
    {
        if (!(frequencyHz > 0) || !(frequencyHz < sampleRateHz / 2))
        {
            throw new ArgumentOutOfRangeException(nameof(frequencyHz), frequencyHz, "Frequency must be between 0 and the Nyquist frequency (Hz).");
        }

        return 2.0 * sampleRateHz * Math.Tan(Math.PI * frequencyHz / sampleRateHz);
    }
}
