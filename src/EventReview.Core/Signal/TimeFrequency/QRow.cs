namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>One frequency row of a Q plane: centre frequency (Hz), the half-width of its bisquare window in frequency (Hz), and the number of time tiles over the analysed segment (a power of two).</summary>
public sealed record QRow(double FrequencyHz, double HalfBandwidthHz, int TileCount);
