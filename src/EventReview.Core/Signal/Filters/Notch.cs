using System.Numerics;

namespace EventReview.Core.Signal.Filters;

/// <summary>Second-order IIR notch filter for removing a spectral line.</summary>
public static class Notch
{
    /// <summary>
    /// Designs a digital notch at <paramref name="frequencyHz"/> with quality factor Q = f0 / (−3 dB bandwidth).
    /// Zeros on the unit circle at e^{±jω0}; unit gain at DC and Nyquist. Returns a digital ZPK (z-plane).
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">When f0 is not strictly between 0 and Nyquist or Q is not positive.</exception>
    // Orfanidis, "Introduction to Signal Processing" (1996), section 11.3, second-order notch with 3 dB bandwidth.
    public static Zpk Design(double frequencyHz, double quality, double sampleRateHz)
    {
        if (!(frequencyHz > 0) || !(frequencyHz < sampleRateHz / 2))
        {
            throw new ArgumentOutOfRangeException(nameof(frequencyHz), frequencyHz, "Notch frequency must be between 0 and the Nyquist frequency (Hz).");
        }

        if (!(quality > 0) || !double.IsFinite(quality))
        {
            throw new ArgumentOutOfRangeException(nameof(quality), quality, "Quality factor must be a positive finite number.");
        }

        double w0 = 2 * Math.PI * frequencyHz / sampleRateHz;
        double bw = w0 / quality;
        double beta = Math.Tan(bw / 2);
        double gain = 1 / (1 + beta);
        // Denominator 1 - 2 g cos(w0) z^-1 + (2g - 1) z^-2.
        double a1 = -2 * gain * Math.Cos(w0), a2 = (2 * gain) - 1;
        var disc = Complex.Sqrt((a1 * a1) - (4 * a2));
        var p1 = (-a1 + disc) / 2;
        var p2 = (-a1 - disc) / 2;
        var z1 = Complex.Exp(new Complex(0, w0));
        return new Zpk([z1, Complex.Conjugate(z1)], [p1, p2], gain);
    }
}
