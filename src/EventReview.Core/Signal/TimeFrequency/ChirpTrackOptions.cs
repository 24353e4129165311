namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Settings of the chirp ridge fit.</summary>
/// <param name="EnergyThreshold">Smallest ridge value (power / median of the Q map) for a column to count as loud (default 12: a single
/// tile of white noise exceeds it with probability exp(−12 ln 2) ≈ 2.4e-4; isolated noise columns are kept off the track by the gap rule).</param>
/// <param name="MinimumPoints">Fewest ridge points needed for a fit (default 5).</param>
/// <param name="MinimumRSquared">Smallest weighted R² of the f^(-8/3)-versus-time line for a chirp-like verdict (default 0.8).</param>
/// <param name="MaxGapSeconds">Largest time between consecutive track points (default 0.1 s, or three tile durations when longer).</param>
/// <param name="HighMassMsun">Chirp mass above which the signal is short in band and the fit says what it cannot tell (default 30 solar masses, as the issue asks).</param>
public sealed record ChirpTrackOptions(double EnergyThreshold = 12, int MinimumPoints = 5, double MinimumRSquared = 0.8, double MaxGapSeconds = 0.1, double HighMassMsun = 30);
