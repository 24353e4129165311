using EventReview.Core.Time;

namespace EventReview.Core.Signal.Overlap;

/// <summary>Settings of the waveform overlap check.</summary>
/// <param name="Center">GPS time of the candidate; the on-source window is centred here.</param>
/// <param name="WindowSeconds">Length of the on-source correlation window in seconds (default 0.2).</param>
/// <param name="MaxLagSeconds">Largest |lag| searched, in seconds: the pair's light-travel time plus its timing tolerance
/// (<see cref="Timing.PairWindow"/>); there is no fixed default, because it depends on the pair.</param>
/// <param name="Conditioning">PSD, whitening, band and notch settings (default: <see cref="ConditioningOptions"/>, median-averaged PSD).</param>
/// <param name="OffSourceCount">Number of off-source (time-slid) overlaps for the empirical p-value (default 0 = none).</param>
/// <param name="OffSourceExclusionSeconds">Half-width around the centre that off-source windows avoid, in seconds (default 0.5).</param>
/// <param name="PlotSeconds">Span of the waveforms returned for plotting, centred on the candidate, in seconds (default 0.3).</param>
/// <param name="MaxPlotPoints">Largest number of plotted points per waveform (default 2000).</param>
/// <param name="SignMarginDegrees">The sign of B is called undetermined when the phase lies within this many degrees of ±90° (default 30).</param>
public sealed record OverlapOptions(
    GpsTime Center,
    double WindowSeconds,
    double MaxLagSeconds,
    ConditioningOptions? Conditioning = null,
    int OffSourceCount = 0,
    double OffSourceExclusionSeconds = 0.5,
    double PlotSeconds = 0.3,
    int MaxPlotPoints = 2000,
    double SignMarginDegrees = 30);
