using EventReview.Core.Time;

namespace EventReview.Core.Signal.Overlap;

/// <summary>Settings of the waveform overlap check.</summary>
/// <param name="Center">GPS time of the candidate; the on-source window is centred here.</param>
/// <param name="WindowSeconds">Length of the on-source correlation window in seconds (default 0.2).</param>
/// <param name="MaxLagSeconds">Largest |lag| searched, in seconds (default 0.012: light-travel time plus tolerance; see <see cref="MaxLagFromLightTravel"/>).</param>
/// <param name="Conditioning">PSD, whitening, band and notch settings (default 30-350 Hz, 4 s PSD segments).</param>
/// <param name="OffSourceCount">Number of off-source (time-slid) overlaps for the empirical p-value (default 0 = none).</param>
/// <param name="OffSourceExclusionSeconds">Half-width around the centre that off-source windows avoid, in seconds (default 0.5).</param>
/// <param name="PlotSeconds">Span of the waveforms returned for plotting, centred on the candidate, in seconds (default 0.3).</param>
/// <param name="MaxPlotPoints">Largest number of plotted points per waveform (default 2000).</param>
public sealed record OverlapOptions(
    GpsTime Center,
    double WindowSeconds = 0.2,
    double MaxLagSeconds = 0.012,
    ConditioningOptions? Conditioning = null,
    int OffSourceCount = 0,
    double OffSourceExclusionSeconds = 0.5,
    double PlotSeconds = 0.3,
    int MaxPlotPoints = 2000)
{
    /// <summary>Maximum lag in seconds from a light-travel time and the two sites' timing tolerances (simple sum).</summary>
    public static double MaxLagFromLightTravel(double lightTravelSeconds, double toleranceSeconds) => lightTravelSeconds + toleranceSeconds;
}
