using EventReview.Core.Geodesy;

namespace EventReview.Core.Timing;

/// <summary>An Earth-fixed unit direction toward the source and its RMS arrival-time residual in seconds.</summary>
public readonly record struct SkyFitDirection(Vector3 Direction, double ResidualSeconds);
