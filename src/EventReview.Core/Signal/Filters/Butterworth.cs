using System.Numerics;

namespace EventReview.Core.Signal.Filters;

/// <summary>
/// Butterworth filter design: analogue prototype, frequency transformation of the pre-warped edges, then the
/// bilinear transform with K = 2 fs. Results are digital ZPKs; their −3 dB points fall exactly on the given edges.
/// </summary>
// Butterworth prototype and lowpass-to-bandpass transformation: Parks and Burrus, "Digital Filter Design" (1987), ch. 7.
public static class Butterworth
{
    /// <summary>Analogue Butterworth low-pass prototype of the given order with cut-off 1 rad/s (no zeros, unit gain).</summary>
    public static Zpk AnalogPrototype(int order)
    {
        if (order < 1 || order > 32)
        {
            throw new ArgumentOutOfRangeException(nameof(order), order, "Filter order must be between 1 and 32.");
        }

        var poles = new Complex[order];
        for (int i = 0; i < order; i++)
        {
            int m = -order + 1 + (2 * i);
            poles[i] = -Complex.Exp(new Complex(0, Math.PI * m / (2.0 * order)));
        }

        return new Zpk(Array.Empty<Complex>(), poles, 1.0);
    }

    /// <summary>Digital low-pass of the given order with −3 dB at <paramref name="cutoffHz"/>.</summary>
    public static Zpk LowPass(int order, double cutoffHz, double sampleRateHz)
    {
        double wo = Bilinear.PrewarpRadPerSecond(cutoffHz, sampleRateHz);
        var proto = AnalogPrototype(order);
        var poles = proto.Poles.Select(p => p * wo).ToArray();
        var analog = new Zpk(Array.Empty<Complex>(), poles, Math.Pow(wo, order));
        return Bilinear.Transform(analog, sampleRateHz);
    }

    /// <summary>Digital high-pass of the given order with −3 dB at <paramref name="cutoffHz"/>.</summary>
    public static Zpk HighPass(int order, double cutoffHz, double sampleRateHz)
    {
        double wo = Bilinear.PrewarpRadPerSecond(cutoffHz, sampleRateHz);
        var proto = AnalogPrototype(order);
        var poles = proto.Poles.Select(p => wo / p).ToArray();
        Complex prodNegP = Complex.One;
        foreach (var p in proto.Poles)
        {
            prodNegP *= -p;
        }

        var zeros = new Complex[order];
        var analog = new Zpk(zeros, poles, (Complex.One / prodNegP).Real);
        return Bilinear.Transform(analog, sampleRateHz);
    }

    /// <summary>
    /// Digital band-pass with −3 dB at <paramref name="lowHz"/> and <paramref name="highHz"/>. The prototype order is
    /// <paramref name="order"/>, so the digital filter has 2·order poles (the convention of the usual reference library).
    /// </summary>
    public static Zpk BandPass(int order, double lowHz, double highHz, double sampleRateHz)
    {
        if (!(lowHz < highHz))
        {
            throw new ArgumentOutOfRangeException(nameof(lowHz), lowHz, "Band-pass low edge must be below the high edge (Hz).");
        }

        double w1 = Bilinear.PrewarpRadPerSecond(lowHz, sampleRateHz);
        double w2 = Bilinear.PrewarpRadPerSecond(highHz, sampleRateHz);
        double bw = w2 - w1, wo2 = w1 * w2;
        var proto = AnalogPrototype(order);
        var poles = new Complex[2 * order];
        for (int i = 0; i < order; i++)
        {
            var pl = proto.Poles[i] * bw / 2;
            var root = Complex.Sqrt((pl * pl) - wo2);
            poles[i] = pl + root;
            poles[order + i] = pl - root;
        }

        var zeros = new Complex[order];
        var analog = new Zpk(zeros, poles, Math.Pow(bw, order));
        return Bilinear.Transform(analog, sampleRateHz);
    }
}
