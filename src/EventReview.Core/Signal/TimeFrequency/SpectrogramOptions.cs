namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Settings of the short-time Fourier transform map.</summary>
/// <param name="SegmentSeconds">Length of each Hann-windowed segment, seconds (default 0.125: 8 Hz resolution).</param>
/// <param name="StepSeconds">Time between segment centres, seconds (default 1/128).</param>
/// <param name="ZeroPadFactor">Zero-padding factor of each segment's FFT (default 4: grid 4 times finer than the resolution).</param>
/// <param name="LowHz">Lowest frequency kept, Hz (default 20).</param>
/// <param name="HighHz">Highest frequency kept, Hz (default 500).</param>
public sealed record SpectrogramOptions(
    double SegmentSeconds = 0.125,
    double StepSeconds = 1.0 / 128,
    int ZeroPadFactor = 4,
    double LowHz = 20,
    double HighHz = 500);
