using EventReview.Core.Geodesy;

namespace EventReview.Core.Timing;

/// <summary>
/// A source direction consistent with the arrival times: RA/Dec in degrees (mean-of-date, GMST rotation with UT1 taken as UTC),
/// the RMS arrival-time residual in seconds over the sites (after fitting the geocentre time), and the Earth-fixed unit vector.
/// </summary>
public sealed record SkySolution(double RaDegrees, double DecDegrees, double ResidualSeconds, Vector3 Direction);
