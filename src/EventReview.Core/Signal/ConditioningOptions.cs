namespace EventReview.Core.Signal;

/// <summary>How a strain series is conditioned before comparison: PSD, whitening, band-pass and notches.</summary>
/// <param name="LowHz">Band-pass lower −3 dB edge in Hz (default <see cref="DefaultLowHz"/>).</param>
/// <param name="HighHz">Band-pass upper −3 dB edge in Hz (default <see cref="DefaultHighHz"/>).</param>
/// <param name="FilterOrder">Butterworth prototype order (default 4, i.e. 8 poles for the band-pass).</param>
/// <param name="PsdSegmentSeconds">Welch segment length in seconds (default 4; shortened to the data if needed).</param>
/// <param name="TaperSeconds">Tukey taper at each end before whitening, in seconds (default 0.5).</param>
/// <param name="SettleSeconds">Extra margin inside the taper treated as unreliable (filter transients), in seconds (default 0.25).</param>
/// <param name="NotchFrequenciesHz">Line frequencies to notch out (Hz); empty for none.</param>
/// <param name="NotchQuality">Quality factor of each notch (default 30).</param>
/// <param name="PsdAverage">How the Welch segments are combined (default median: a loud signal or glitch in a few segments does not
/// raise the noise estimate, so whitening does not suppress the signal's own band).</param>
public sealed record ConditioningOptions(
    double LowHz = ConditioningOptions.DefaultLowHz,
    double HighHz = ConditioningOptions.DefaultHighHz,
    int FilterOrder = 4,
    double PsdSegmentSeconds = 4,
    double TaperSeconds = 0.5,
    double SettleSeconds = 0.25,
    IReadOnlyList<double>? NotchFrequenciesHz = null,
    double NotchQuality = 30,
    Spectra.WelchAverage PsdAverage = Spectra.WelchAverage.Median)
{
    /// <summary>Default band-pass lower edge, Hz: 25, our own choice (below it ground motion dominates the noise of a typical site).</summary>
    public const double DefaultLowHz = 25;

    /// <summary>Default band-pass upper edge, Hz: 400, our own choice (covers the late inspiral of the chirp masses the demo and
    /// the simulator use; above it shot noise rises and little of such a signal's power remains).</summary>
    public const double DefaultHighHz = 400;
}
