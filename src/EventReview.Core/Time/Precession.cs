using EventReview.Core.Geodesy;

namespace EventReview.Core.Time;

/// <summary>
/// Precession of the mean equator and equinox between J2000.0 and a date, IAU 1976 model (Lieske et al. 1977,
/// A&amp;A 58, 1), with the angles ζ, z, θ as printed in Meeus, "Astronomical Algorithms", 2nd ed., eq. 21.3 for a start at
/// J2000.0. Used to state how far the app's mean-of-date RA/Dec lie from J2000 / ICRS coordinates (the frame bias between
/// J2000 and ICRS, 0.02″, and nutation, below 0.006°, are left out and said so).
/// </summary>
public static class Precession
{
    private static readonly DateTime J2000 = new(2000, 1, 1, 12, 0, 0, DateTimeKind.Utc);

    /// <summary>Julian centuries of 36525 days from J2000.0 to <paramref name="utc"/> (UTC taken as TT: the 69 s between them move a direction by less than 1e-6°).</summary>
    public static double CenturiesSinceJ2000(DateTime utc) => (utc - J2000).TotalDays / 36525.0;

    /// <summary>Mean-of-date RA/Dec (degrees) of a J2000.0 mean RA/Dec at <paramref name="centuries"/> Julian centuries after J2000.0.</summary>
    public static EquatorialDirection FromJ2000(EquatorialDirection j2000, double centuries) =>
        ToDirection(Apply(Matrix(centuries), ToVector(j2000), transpose: false));

    /// <summary>J2000.0 mean RA/Dec (degrees) of a mean-of-date RA/Dec at <paramref name="centuries"/> Julian centuries after J2000.0.</summary>
    public static EquatorialDirection ToJ2000(EquatorialDirection meanOfDate, double centuries) =>
        ToDirection(Apply(Matrix(centuries), ToVector(meanOfDate), transpose: true));

    /// <summary>
    /// Angle in degrees between a mean-of-date direction and the same RA/Dec numbers read as J2000 coordinates: how far off a
    /// reader would be who took the app's RA/Dec for ICRS.
    /// </summary>
    public static double OffsetDegrees(EquatorialDirection meanOfDate, double centuries)
    {
        var j2000 = ToJ2000(meanOfDate, centuries);
        return double.RadiansToDegrees(Vector3.AngleBetween(ToVector(meanOfDate), ToVector(j2000)));
    }

    /// <summary>Rotation P with v(date) = P v(J2000): P = R3(−z) R2(θ) R3(−ζ) (Meeus eq. 21.4 in matrix form).</summary>
    private static double[,] Matrix(double t)
    {
        const double ArcsecToRad = Math.PI / (180.0 * 3600.0);
        double zeta = ((2306.2181 * t) + (0.30188 * t * t) + (0.017998 * t * t * t)) * ArcsecToRad;
        double z = ((2306.2181 * t) + (1.09468 * t * t) + (0.018203 * t * t * t)) * ArcsecToRad;
        double theta = ((2004.3109 * t) - (0.42665 * t * t) - (0.041833 * t * t * t)) * ArcsecToRad;
        var (sz, cz) = Math.SinCos(zeta);
        var (sZ, cZ) = Math.SinCos(z);
        var (st, ct) = Math.SinCos(theta);
        return new[,]
        {
            { (cZ * ct * cz) - (sZ * sz), -(cZ * ct * sz) - (sZ * cz), -cZ * st },
            { (sZ * ct * cz) + (cZ * sz), -(sZ * ct * sz) + (cZ * cz), -sZ * st },
            { st * cz, -st * sz, ct },
        };
    }

    private static Vector3 Apply(double[,] m, Vector3 v, bool transpose)
    {
        double M(int i, int j) => transpose ? m[j, i] : m[i, j];
        return new Vector3(
            (M(0, 0) * v.X) + (M(0, 1) * v.Y) + (M(0, 2) * v.Z),
            (M(1, 0) * v.X) + (M(1, 1) * v.Y) + (M(1, 2) * v.Z),
            (M(2, 0) * v.X) + (M(2, 1) * v.Y) + (M(2, 2) * v.Z));
    }

    private static Vector3 ToVector(EquatorialDirection d)
    {
        var (sa, ca) = Math.SinCos(double.DegreesToRadians(d.RaDegrees));
        var (sd, cd) = Math.SinCos(double.DegreesToRadians(d.DecDegrees));
        return new Vector3(cd * ca, cd * sa, sd);
    }

    private static EquatorialDirection ToDirection(Vector3 v)
    {
        var n = v.Normalized();
        var ra = double.RadiansToDegrees(Math.Atan2(n.Y, n.X));
        return new EquatorialDirection(ra < 0 ? ra + 360 : ra, double.RadiansToDegrees(Math.Asin(Math.Clamp(n.Z, -1.0, 1.0))));
    }
}
