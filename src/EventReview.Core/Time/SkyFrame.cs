using EventReview.Core.Geodesy;

namespace EventReview.Core.Time;

/// <summary>
/// Earth-fixed (ECEF) unit vectors &lt;-&gt; right ascension / declination by a rotation through Greenwich mean
/// sidereal time about the z axis. The result is a mean-of-date frame: no precession to J2000, no nutation, no
/// polar motion, UT1 taken as UTC. It differs from ICRS by up to ~0.2° at current epochs; label it as such.
/// </summary>
public static class SkyFrame
{
    /// <summary>RA/Dec (degrees) of an ECEF direction (any non-zero length) at a given GMST (degrees). RA = ECEF longitude + GMST.</summary>
    public static EquatorialDirection ToEquatorial(Vector3 ecefDirection, double gmstDegrees)
    {
        var n = ecefDirection.Normalized();
        var dec = double.RadiansToDegrees(Math.Asin(Math.Clamp(n.Z, -1.0, 1.0)));
        var ra = (double.RadiansToDegrees(Math.Atan2(n.Y, n.X)) + gmstDegrees) % 360.0;
        if (ra < 0)
        {
            ra += 360.0;
        }

        return new EquatorialDirection(ra, dec);
    }

    /// <summary>ECEF unit vector of a direction at RA/Dec (degrees) and GMST (degrees).</summary>
    public static Vector3 ToEcef(double raDegrees, double decDegrees, double gmstDegrees)
    {
        var hourAngle = double.DegreesToRadians(raDegrees - gmstDegrees);
        var dec = double.DegreesToRadians(decDegrees);
        return new Vector3(Math.Cos(dec) * Math.Cos(hourAngle), Math.Cos(dec) * Math.Sin(hourAngle), Math.Sin(dec));
    }
}
