namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Settings of the chirp ridge fit.</summary>
/// <param name="EnergyThreshold">Smallest ridge value (power / median of the Q map) for a column to count as loud (default 18: a single
/// tile of white noise exceeds it with probability exp(−18 ln 2) ≈ 4e-6).</param>
/// <param name="MinimumPoints">Fewest ridge points needed for a fit (default 5).</param>
/// <param name="MinimumRSquared">Smallest weighted R² of the f^(-8/3)-versus-time line for a chirp-like verdict (default 0.8).</param>
/// <param name="HighMassMsun">Chirp mass above which the signal is short in band and the fit says what it cannot tell (default 30 solar masses, as the issue asks).</param>
public sealed record ChirpTrackOptions(double EnergyThreshold = 18, int MinimumPoints = 5, double MinimumRSquared = 0.8, double HighMassMsun = 30);
