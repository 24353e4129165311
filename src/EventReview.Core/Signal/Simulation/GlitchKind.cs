namespace EventReview.Core.Signal.Simulation;

/// <summary>Shapes of simulated instrumental transients.</summary>
public enum GlitchKind
{
    /// <summary>Sine-Gaussian: A sin(2π f0 (t − t0)) exp(−(t − t0)²/τ²), τ = Q / (√2 π f0).</summary>
    SineGaussian,

    /// <summary>Short symmetric glitch: a cosine-Gaussian with Q = 1.5, one or two cycles long and even about its peak.</summary>
    ShortSymmetric,
}
