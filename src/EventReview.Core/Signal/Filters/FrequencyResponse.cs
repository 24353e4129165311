using System.Numerics;

namespace EventReview.Core.Signal.Filters;

/// <summary>Evaluates filter responses from zero-pole-gain form.</summary>
public static class FrequencyResponse
{
    /// <summary>Complex response of a digital ZPK at <paramref name="frequencyHz"/>: H(e^{j 2π f / fs}).</summary>
    public static Complex Digital(Zpk digital, double frequencyHz, double sampleRateHz)
    {
        ArgumentNullException.ThrowIfNull(digital);
        var z = Complex.Exp(new Complex(0, 2 * Math.PI * frequencyHz / sampleRateHz));
        return Evaluate(digital, z);
    }

    /// <summary>Magnitude |H| of a digital ZPK at <paramref name="frequencyHz"/> (Hz) for sample rate fs (Hz).</summary>
    public static double Magnitude(Zpk digital, double frequencyHz, double sampleRateHz) =>
        Digital(digital, frequencyHz, sampleRateHz).Magnitude;

    /// <summary>Complex response of an analogue ZPK (rad/s) at <paramref name="frequencyHz"/>: H(j 2π f).</summary>
    public static Complex Analog(Zpk analog, double frequencyHz)
    {
        ArgumentNullException.ThrowIfNull(analog);
        return Evaluate(analog, new Complex(0, 2 * Math.PI * frequencyHz));
    }

    /// <summary>|H| of cascaded sections at <paramref name="frequencyHz"/> (Hz).</summary>
    public static double Magnitude(IReadOnlyList<SosSection> sections, double frequencyHz, double sampleRateHz)
    {
        ArgumentNullException.ThrowIfNull(sections);
        var zinv = Complex.Exp(new Complex(0, -2 * Math.PI * frequencyHz / sampleRateHz));
        Complex h = Complex.One;
        foreach (var s in sections)
        {
            h *= (s.B0 + (zinv * (s.B1 + (zinv * s.B2)))) / (1 + (zinv * (s.A1 + (zinv * s.A2))));
        }

        return h.Magnitude;
    }

    private static Complex Evaluate(Zpk zpk, Complex x)
    {
        Complex h = zpk.Gain;
        foreach (var z in zpk.Zeros)
        {
            h *= x - z;
        }

        foreach (var p in zpk.Poles)
        {
            h /= x - p;
        }

        return h;
    }
}
