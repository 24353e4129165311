using EventReview.Core.Network;

namespace EventReview.Core.Geodesy;

/// <summary>Geometry of one site: ECEF position, local frame, arm unit vectors and detector tensor.</summary>
public static class SiteGeometry
{
    /// <summary>ECEF position of the site's vertex (metres) from its WGS-84 latitude, longitude and height.</summary>
    public static Vector3 Position(Site site)
    {
        ArgumentNullException.ThrowIfNull(site);
        return Wgs84.ToEcef(site.LatitudeDegrees, site.LongitudeDegrees, site.HeightMeters);
    }

    /// <summary>East-North-Up frame at the site.</summary>
    public static LocalFrame Frame(Site site)
    {
        ArgumentNullException.ThrowIfNull(site);
        return LocalFrame.At(site.LatitudeDegrees, site.LongitudeDegrees);
    }

    /// <summary>ECEF unit vector of the x arm (azimuth clockwise from true north, optional tilt in degrees above the horizontal).</summary>
    public static Vector3 XArm(Site site, double tiltDegrees = 0) => Frame(site).Direction(site.XArmAzimuthDegrees, tiltDegrees);

    /// <summary>ECEF unit vector of the y arm (azimuth clockwise from true north, optional tilt in degrees above the horizontal).</summary>
    public static Vector3 YArm(Site site, double tiltDegrees = 0) => Frame(site).Direction(site.YArmAzimuthDegrees, tiltDegrees);

    /// <summary>Detector tensor D = (x xᵀ - y yᵀ)/2 of the site in ECEF, arms horizontal.</summary>
    public static double[,] Tensor(Site site) => DetectorTensor.FromArms(XArm(site), YArm(site));
}
