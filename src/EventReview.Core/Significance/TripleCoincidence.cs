namespace EventReview.Core.Significance;

/// <summary>A three-site coincidence (zero lag or background).</summary>
/// <param name="Slide">k: the second site moved by k x step, the third by 2k x step (0 = zero lag).</param>
/// <param name="TimesNs">GPS ns of the three triggers before any shift, in site order.</param>
/// <param name="Snrs">SNRs of the three triggers, in site order.</param>
/// <param name="Statistic">Network SNR over all three, sqrt(sum of squares).</param>
public sealed record TripleCoincidence(int Slide, IReadOnlyList<long> TimesNs, IReadOnlyList<double> Snrs, double Statistic);
