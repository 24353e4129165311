namespace EventReview.Core.Signal.Simulation;

/// <summary>Waveforms of simulated glitches.</summary>
public static class GlitchWaveform
{
    /// <summary>
    /// Adds a glitch centred <paramref name="centerSeconds"/> after sample 0 into <paramref name="target"/>:
    /// sine-Gaussian A sin(2π f0 (t − t0)) e^{−(t − t0)²/τ²} with τ = Q/(√2 π f0), or for a short symmetric glitch the cosine form with Q = 1.5.
    /// Only samples within 6 τ of the centre are touched.
    /// </summary>
    // Sine-Gaussian burst model as commonly used for transient searches, e.g. Chatterji et al., CQG 21 (2004) S1809.
    public static void AddTo(Span<double> target, double sampleRateHz, double centerSeconds, GlitchKind kind, double frequencyHz, double quality, double amplitude)
    {
        if (!(frequencyHz > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(frequencyHz), frequencyHz, "Glitch frequency must be positive (Hz).");
        }

        double q = kind == GlitchKind.ShortSymmetric ? 1.5 : quality;
        if (!(q > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(quality), quality, "Quality factor must be positive.");
        }

        double tau = q / (Math.Sqrt(2) * Math.PI * frequencyHz);
        int i0 = Math.Max(0, (int)Math.Floor((centerSeconds - (6 * tau)) * sampleRateHz));
        int i1 = Math.Min(target.Length, (int)Math.Ceiling((centerSeconds + (6 * tau)) * sampleRateHz));
        for (int i = i0; i < i1; i++)
        {
            double dt = (i / sampleRateHz) - centerSeconds;
            double env = Math.Exp(-(dt * dt) / (tau * tau));
            double carrier = kind == GlitchKind.ShortSymmetric ? Math.Cos(2 * Math.PI * frequencyHz * dt) : Math.Sin(2 * Math.PI * frequencyHz * dt);
            target[i] += amplitude * env * carrier;
        }
    }
}
