namespace EventReview.Core.Signal.Spectra;

/// <summary>Settings of the Welch estimate.</summary>
/// <param name="SegmentLength">Samples per segment (a power of two is fastest).</param>
/// <param name="OverlapLength">Samples shared by consecutive segments; null for 50 % (SegmentLength / 2).</param>
/// <param name="RemoveMean">Subtract each segment's mean before windowing (default false: no detrending).</param>
/// <param name="Average">How segments are combined (default <see cref="WelchAverage.Mean"/>).</param>
public sealed record WelchOptions(int SegmentLength, int? OverlapLength = null, bool RemoveMean = false, WelchAverage Average = WelchAverage.Mean);
