namespace EventReview.Core.Significance;

/// <summary>A coincidence as a finder emits it: slide k, trigger indices into the sorted lists of sites A and B, ranking statistic.</summary>
/// <param name="Slide">k (site B moved by k x step).</param>
/// <param name="IndexA">Site-A trigger index.</param>
/// <param name="IndexB">Site-B trigger index.</param>
/// <param name="Statistic">Network SNR.</param>
public readonly record struct FoundCoincidence(int Slide, int IndexA, int IndexB, double Statistic);
