namespace EventReview.Core.Significance;

/// <summary>
/// One coincidence found at a slide, identified by the trigger indices into each site's sorted trigger list.
/// </summary>
/// <param name="Slide">k: site B was moved by k x step (0 = zero lag).</param>
/// <param name="IndexA">Index of the site-A trigger.</param>
/// <param name="IndexB">Index of the site-B trigger.</param>
/// <param name="TimeANs">GPS ns of the site-A trigger.</param>
/// <param name="TimeBNs">GPS ns of the site-B trigger before the shift.</param>
/// <param name="Statistic">Ranking statistic (network SNR, root sum of squares).</param>
public readonly record struct SlideCoincidence(int Slide, int IndexA, int IndexB, long TimeANs, long TimeBNs, double Statistic);
