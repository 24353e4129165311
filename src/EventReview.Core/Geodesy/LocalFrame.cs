namespace EventReview.Core.Geodesy;

/// <summary>
/// The local East-North-Up frame at a geodetic position, as ECEF unit vectors. "Up" is the ellipsoid
/// normal (geodetic vertical), "North" points along the meridian toward the north pole, "East" completes
/// the right-handed set (East × North = Up).
/// </summary>
public readonly record struct LocalFrame(Vector3 East, Vector3 North, Vector3 Up)
{
    /// <summary>The East-North-Up frame at geodetic latitude and longitude (degrees).</summary>
    public static LocalFrame At(double latitudeDegrees, double longitudeDegrees)
    {
        var phi = double.DegreesToRadians(latitudeDegrees);
        var lambda = double.DegreesToRadians(longitudeDegrees);
        var (sinPhi, cosPhi) = Math.SinCos(phi);
        var (sinLambda, cosLambda) = Math.SinCos(lambda);
        return new LocalFrame(
            new Vector3(-sinLambda, cosLambda, 0),
            new Vector3(-sinPhi * cosLambda, -sinPhi * sinLambda, cosPhi),
            new Vector3(cosPhi * cosLambda, cosPhi * sinLambda, sinPhi));
    }

    /// <summary>
    /// ECEF unit vector of a horizontal direction at azimuth (degrees clockwise from true north) tilted by
    /// <paramref name="tiltDegrees"/> above the local horizontal (positive = upward, negative = downward).
    /// </summary>
    public Vector3 Direction(double azimuthDegrees, double tiltDegrees = 0)
    {
        var az = double.DegreesToRadians(azimuthDegrees);
        var tilt = double.DegreesToRadians(tiltDegrees);
        var horizontal = (Math.Sin(az) * East) + (Math.Cos(az) * North);
        return (Math.Cos(tilt) * horizontal) + (Math.Sin(tilt) * Up);
    }
}
