using EventReview.Core.Geodesy;

namespace EventReview.Core.Timing;

/// <summary>
/// A source direction consistent with the arrival times: RA/Dec in degrees in the mean-of-date frame (GMST rotation with UT1 taken
/// as UTC, no nutation), the RMS arrival-time residual in seconds over the sites (after fitting the geocentre time), the chi-square
/// of the direction (residuals in units of each site's timing uncertainty), the angle in degrees between this mean-of-date position
/// and the same numbers read as J2000 / ICRS coordinates (IAU 1976 precession, <see cref="Time.Precession"/>), and the Earth-fixed
/// unit vector.
/// </summary>
public sealed record SkySolution(double RaDegrees, double DecDegrees, double ResidualSeconds, Vector3 Direction, double ChiSquare = 0, double IcrsOffsetDegrees = 0);
