using System.Numerics;
using EventReview.Core.Signal.Filters;

namespace EventReview.Core.Chain;

/// <summary>
/// The known model of one stage of the data chain: an analogue zero-pole-gain filter given in Hz plus a pure delay.
/// Roots are s-plane values divided by 2 pi (a stable pole has a negative real part); the response is
/// H(s) = Gain x prod(s - 2 pi z) / prod(s - 2 pi p) with s in rad/s.
/// </summary>
/// <param name="ZerosHz">Zeros in Hz (complex ones in conjugate pairs).</param>
/// <param name="PolesHz">Poles in Hz (complex ones in conjugate pairs); every real part must be &lt; 0.</param>
/// <param name="Gain">Gain factor of the rad/s form above (not the pass-band gain).</param>
/// <param name="DelaySeconds">Pure delay; positive means the output lags the input.</param>
/// <param name="PrewarpHz">Frequency where the bilinear transform is matched exactly; null uses the geometric mean of the
/// magnitudes of the non-zero roots (no pre-warp when there is none); 0 means no pre-warp (K = 2 fs).</param>
/// <param name="ExpectedNoiseRms">RMS of the residual expected from the stage when nothing is wrong (for example the output's
/// quantisation, step / sqrt 12), in output units; null when not stated (the off-source residual is then not compared with it).</param>
public sealed record ChainStageModel(IReadOnlyList<Complex> ZerosHz, IReadOnlyList<Complex> PolesHz, double Gain, double DelaySeconds = 0, double? PrewarpHz = null,
    double? ExpectedNoiseRms = null)
{
    /// <summary>The analogue filter in rad/s (roots multiplied by 2 pi), as used by <see cref="Bilinear"/>.</summary>
    public Zpk ToAnalog() => new(
        ZerosHz.Select(z => z * 2 * Math.PI).ToList(),
        PolesHz.Select(p => p * 2 * Math.PI).ToList(),
        Gain);

    /// <summary>
    /// Pre-warp frequency actually used, in Hz, or null for none: the explicit value when &gt; 0, otherwise the geometric
    /// mean of the non-zero root magnitudes (Hz); null when that is missing or not below the Nyquist frequency.
    /// </summary>
    public double? EffectivePrewarpHz(double sampleRateHz)
    {
        if (PrewarpHz is { } explicitHz)
        {
            return explicitHz > 0 ? explicitHz : null;
        }

        var mags = ZerosHz.Concat(PolesHz).Select(r => r.Magnitude).Where(m => m > 0).ToList();
        if (mags.Count == 0)
        {
            return null;
        }

        var geo = Math.Exp(mags.Average(Math.Log));
        return geo < sampleRateHz / 2 ? geo : null;
    }

    /// <summary>
    /// Checks the model: finite values, conjugate-paired roots, no unstable pole (real part &gt;= 0), at least as many
    /// poles as zeros. Throws <see cref="ArgumentException"/> naming the stage (1-based) and the root.
    /// </summary>
    public void Validate(int stageNumber)
    {
        if (!double.IsFinite(Gain) || Gain == 0)
        {
            throw new ArgumentException($"stage {stageNumber}: gain must be finite and non-zero", nameof(Gain));
        }

        if (!double.IsFinite(DelaySeconds))
        {
            throw new ArgumentException($"stage {stageNumber}: delaySeconds must be finite", nameof(DelaySeconds));
        }

        if (ExpectedNoiseRms is { } noise && (!double.IsFinite(noise) || noise <= 0))
        {
            throw new ArgumentException($"stage {stageNumber}: expectedNoiseRms must be > 0 or null", nameof(ExpectedNoiseRms));
        }

        if (PrewarpHz is { } pw && (!double.IsFinite(pw) || pw < 0))
        {
            throw new ArgumentException($"stage {stageNumber}: prewarpHz must be >= 0 (0 = no pre-warp) or null", nameof(PrewarpHz));
        }

        for (var i = 0; i < PolesHz.Count; i++)
        {
            var p = PolesHz[i];
            if (!double.IsFinite(p.Real) || !double.IsFinite(p.Imaginary))
            {
                throw new ArgumentException($"stage {stageNumber}: pole {i + 1} is not finite", nameof(PolesHz));
            }

            if (p.Real >= 0)
            {
                throw new ArgumentException(
                    $"stage {stageNumber}: pole {i + 1} ({p.Real} {(p.Imaginary < 0 ? "-" : "+")} {Math.Abs(p.Imaginary)}i Hz) has a real part >= 0, so the stage model is unstable (or marginally stable) and cannot predict the output",
                    nameof(PolesHz));
            }
        }

        if (ZerosHz.Any(z => !double.IsFinite(z.Real) || !double.IsFinite(z.Imaginary)))
        {
            throw new ArgumentException($"stage {stageNumber}: a zero is not finite", nameof(ZerosHz));
        }

        if (ZerosHz.Count > PolesHz.Count)
        {
            throw new ArgumentException($"stage {stageNumber}: {ZerosHz.Count} zeros but {PolesHz.Count} poles; a realisable stage needs at least as many poles as zeros", nameof(ZerosHz));
        }

        CheckConjugates(ZerosHz, "zeros", stageNumber);
        CheckConjugates(PolesHz, "poles", stageNumber);
    }

    private static void CheckConjugates(IReadOnlyList<Complex> roots, string what, int stageNumber)
    {
        var pos = roots.Where(r => r.Imaginary > 0).OrderBy(r => r.Real).ThenBy(r => r.Imaginary).ToList();
        var neg = roots.Where(r => r.Imaginary < 0).Select(Complex.Conjugate).OrderBy(r => r.Real).ThenBy(r => r.Imaginary).ToList();
        if (pos.Count != neg.Count || pos.Zip(neg).Any(p => (p.First - p.Second).Magnitude > 1e-9 * Math.Max(1, p.First.Magnitude)))
        {
            throw new ArgumentException($"stage {stageNumber}: complex {what} must come in conjugate pairs", what);
        }
    }
}
