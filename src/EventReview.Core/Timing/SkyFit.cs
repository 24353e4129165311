namespace EventReview.Core.Timing;

/// <summary>
/// Directions that fit a set of arrival times, best (smallest chi-square) first. <see cref="RingsMeet"/> is true when an exact
/// solution exists (three sites whose rings cross, or two or more exact mirror solutions), false when only a least-squares
/// compromise exists; <see cref="MinimalResidualSeconds"/> is the RMS residual of the best direction and
/// <see cref="MinimalChiSquare"/> its chi-square (dimensionless).
/// </summary>
public sealed record SkyFit(IReadOnlyList<SkyFitDirection> Solutions, bool RingsMeet, double MinimalResidualSeconds, double MinimalChiSquare);
