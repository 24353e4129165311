namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Settings of the multi-resolution Q transform.</summary>
/// <param name="QMin">Smallest quality factor Q (tile duration ~ Q / f; default 4: short tiles for short, high-mass signals).</param>
/// <param name="QMax">Largest Q (default 64: long, narrow-band tiles).</param>
/// <param name="LowHz">Lowest centre frequency, Hz (default 20; raised per plane so that a tile fits the analysed span).</param>
/// <param name="HighHz">Highest centre frequency, Hz (default 500; lowered per plane so that a tile stays below Nyquist).</param>
/// <param name="MaxMismatch">Largest fractional energy loss between a signal and its nearest tile (default 0.2).</param>
/// <param name="PadSeconds">Data analysed beyond each end of the requested span, seconds (default 1: keeps the longest tiles away from the segment's wrap-around).</param>
public sealed record QTransformOptions(
    double QMin = 4,
    double QMax = 64,
    double LowHz = 20,
    double HighHz = 500,
    double MaxMismatch = 0.2,
    double PadSeconds = 1);
