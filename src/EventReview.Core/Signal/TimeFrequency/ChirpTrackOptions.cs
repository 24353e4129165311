namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Settings of the chirp ridge fit.</summary>
/// <param name="EnergyThreshold">Smallest ridge energy (noise mean 1) for a column to count as loud (default 12).</param>
/// <param name="MinimumPoints">Fewest ridge points needed for a fit (default 5).</param>
/// <param name="MinimumRSquared">Smallest weighted R² of the f^(-8/3)-versus-time line for a chirp-like verdict (default 0.8).</param>
public sealed record ChirpTrackOptions(double EnergyThreshold = 12, int MinimumPoints = 5, double MinimumRSquared = 0.8);
