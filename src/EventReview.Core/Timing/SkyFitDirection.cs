using EventReview.Core.Geodesy;

namespace EventReview.Core.Timing;

/// <summary>
/// An Earth-fixed unit direction toward the source, its RMS arrival-time residual in seconds and its chi-square
/// (squared residuals in units of each site's timing uncertainty, dimensionless; see <see cref="SkySolver.ChiSquare"/>).
/// </summary>
public readonly record struct SkyFitDirection(Vector3 Direction, double ResidualSeconds, double ChiSquare);
