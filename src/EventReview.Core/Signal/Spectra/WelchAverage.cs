namespace EventReview.Core.Signal.Spectra;

/// <summary>How <see cref="Welch"/> combines the periodograms of its segments.</summary>
public enum WelchAverage
{
    /// <summary>Arithmetic mean (Welch 1967): unbiased for stationary noise, but one loud segment (a signal, a glitch) raises every bin it covers.</summary>
    Mean,

    /// <summary>
    /// Median per frequency bin, divided by the median's bias for χ² (2 dof) periodograms, b(n) = Σ_{k=1}^{n} (−1)^{k+1} / k for
    /// n segments (Allen et al. 2012, Phys. Rev. D 85 122006, appendix B, from memory; the same factor as scipy.signal.welch with
    /// average='median'): robust against a few loud segments.
    /// </summary>
    Median,
}
