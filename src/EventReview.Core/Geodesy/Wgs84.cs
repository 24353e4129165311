namespace EventReview.Core.Geodesy;

/// <summary>
/// The WGS-84 ellipsoid (NIMA TR8350.2: a = 6 378 137 m, 1/f = 298.257223563) and conversions between
/// geodetic coordinates and Earth-centred, Earth-fixed (ECEF) Cartesian coordinates in metres.
/// </summary>
public static class Wgs84
{
    /// <summary>Semi-major axis, metres.</summary>
    public const double SemiMajorAxisMeters = 6_378_137.0;

    /// <summary>Inverse flattening 1/f (dimensionless).</summary>
    public const double InverseFlattening = 298.257223563;

    /// <summary>Flattening f.</summary>
    public const double Flattening = 1.0 / InverseFlattening;

    /// <summary>First eccentricity squared e² = f (2 - f).</summary>
    public const double EccentricitySquared = Flattening * (2.0 - Flattening);

    /// <summary>Semi-minor axis b = a (1 - f), metres.</summary>
    public const double SemiMinorAxisMeters = SemiMajorAxisMeters * (1.0 - Flattening);

    /// <summary>Geodetic (lat, lon in degrees, h in metres) to ECEF metres.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When latitude is outside [-90, 90] or a value is not finite.</exception>
    public static Vector3 ToEcef(double latitudeDegrees, double longitudeDegrees, double heightMeters)
    {
        if (!double.IsFinite(latitudeDegrees) || Math.Abs(latitudeDegrees) > 90)
        {
            throw new ArgumentOutOfRangeException(nameof(latitudeDegrees), latitudeDegrees, "Latitude must be a finite number within [-90, 90] degrees.");
        }

        if (!double.IsFinite(longitudeDegrees) || !double.IsFinite(heightMeters))
        {
            throw new ArgumentOutOfRangeException(nameof(longitudeDegrees), longitudeDegrees, "Longitude and height must be finite.");
        }

        // EPSG Guidance Note 7-2, geographic to geocentric: nu = a / sqrt(1 - e² sin² phi).
        var phi = double.DegreesToRadians(latitudeDegrees);
        var lambda = double.DegreesToRadians(longitudeDegrees);
        var sinPhi = Math.Sin(phi);
        var cosPhi = Math.Cos(phi);
        var nu = SemiMajorAxisMeters / Math.Sqrt(1.0 - (EccentricitySquared * sinPhi * sinPhi));
        return new Vector3(
            (nu + heightMeters) * cosPhi * Math.Cos(lambda),
            (nu + heightMeters) * cosPhi * Math.Sin(lambda),
            (((1.0 - EccentricitySquared) * nu) + heightMeters) * sinPhi);
    }

    /// <summary>Geodetic position to ECEF metres.</summary>
    public static Vector3 ToEcef(GeodeticPosition position) =>
        ToEcef(position.LatitudeDegrees, position.LongitudeDegrees, position.HeightMeters);

    /// <summary>
    /// ECEF metres to geodetic coordinates. Starts from Bowring's formula and iterates the latitude until it
    /// changes by less than 1e-12 rad (~6e-11 deg); longitude in (-180, 180]. Valid for any point not at the
    /// Earth's centre; on the polar axis the longitude is returned as 0.
    /// </summary>
    public static GeodeticPosition FromEcef(Vector3 ecef)
    {
        if (!ecef.IsFinite)
        {
            throw new ArgumentOutOfRangeException(nameof(ecef), ecef, "ECEF coordinates must be finite.");
        }

        var a = SemiMajorAxisMeters;
        var b = SemiMinorAxisMeters;
        var e2 = EccentricitySquared;
        var ep2 = e2 / (1.0 - e2);
        var p = Math.Sqrt((ecef.X * ecef.X) + (ecef.Y * ecef.Y));
        var lambda = Math.Atan2(ecef.Y, ecef.X);
        if (p < 1e-9)
        {
            var poleLat = ecef.Z >= 0 ? 90.0 : -90.0;
            return new GeodeticPosition(poleLat, 0.0, Math.Abs(ecef.Z) - b);
        }

        // Bowring (1976) starting value, EPSG Guidance Note 7-2 geocentric to geographic.
        var q = Math.Atan2(ecef.Z * a, p * b);
        var phi = Math.Atan2(ecef.Z + (ep2 * b * Math.Pow(Math.Sin(q), 3)), p - (e2 * a * Math.Pow(Math.Cos(q), 3)));
        double h = 0;
        for (var i = 0; i < 20; i++)
        {
            var sinPhi = Math.Sin(phi);
            var nu = a / Math.Sqrt(1.0 - (e2 * sinPhi * sinPhi));
            h = Math.Abs(Math.Cos(phi)) > 1e-12 ? (p / Math.Cos(phi)) - nu : (Math.Abs(ecef.Z) / Math.Abs(sinPhi)) - (nu * (1 - e2));
            var next = Math.Atan2(ecef.Z, p * (1.0 - (e2 * nu / (nu + h))));
            var done = Math.Abs(next - phi) < 1e-12;
            phi = next;
            if (done)
            {
                break;
            }
        }

        var sinFinal = Math.Sin(phi);
        var nuFinal = a / Math.Sqrt(1.0 - (e2 * sinFinal * sinFinal));
        h = (p * Math.Cos(phi)) + (ecef.Z * sinFinal) - (a * a / nuFinal);
        return new GeodeticPosition(double.RadiansToDegrees(phi), double.RadiansToDegrees(lambda), h);
    }
}
