namespace EventReview.Core.Significance;

/// <summary>A coincidence as shown to people (loudest background or zero lag).</summary>
/// <param name="Slide">k: the second site was moved by k x step (0 = zero lag).</param>
/// <param name="TimeANs">GPS ns of the first site's trigger.</param>
/// <param name="TimeBNs">GPS ns of the second site's trigger, before any shift.</param>
/// <param name="SnrA">First site's SNR.</param>
/// <param name="SnrB">Second site's SNR.</param>
/// <param name="Statistic">Ranking statistic (network SNR).</param>
public sealed record BackgroundCoincidence(int Slide, long TimeANs, long TimeBNs, double SnrA, double SnrB, double Statistic);
