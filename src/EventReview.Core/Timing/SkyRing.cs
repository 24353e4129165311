using EventReview.Core.Geodesy;

namespace EventReview.Core.Timing;

/// <summary>The cone of source directions n with n·â = cos θ about a baseline axis â (the sky ring of a pair of sites).</summary>
public static class SkyRing
{
    /// <summary>
    /// <paramref name="count"/> unit vectors evenly spaced in azimuth on the ring; cos θ is clamped to [-1, 1] (a clamped ring is a
    /// single point on the axis, repeated).
    /// </summary>
    public static IReadOnlyList<Vector3> Directions(Vector3 axis, double cosTheta, int count)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 1);
        if (!double.IsFinite(cosTheta))
        {
            throw new ArgumentOutOfRangeException(nameof(cosTheta), cosTheta, "cos θ must be finite.");
        }

        var a = axis.Normalized();
        var helper = Math.Abs(a.X) < 0.9 ? new Vector3(1, 0, 0) : new Vector3(0, 1, 0);
        var u = Vector3.Cross(a, helper).Normalized();
        var v = Vector3.Cross(a, u);
        var c = Math.Clamp(cosTheta, -1.0, 1.0);
        var s = Math.Sqrt(1 - (c * c));
        var result = new Vector3[count];
        for (var k = 0; k < count; k++)
        {
            var (sin, cos) = Math.SinCos(2 * Math.PI * k / count);
            result[k] = (c * a) + (s * ((cos * u) + (sin * v)));
        }

        return result;
    }

    /// <summary>
    /// Ring opening angle in degrees between the source direction and r_a - r_b for arrival difference Δt = t_b - t_a (seconds):
    /// cos θ = c Δt / |r_a - r_b|. Null when |c Δt / d| &gt; 1 (outside the light-travel window), never NaN.
    /// </summary>
    public static double? AngleDegrees(Vector3 positionAMeters, Vector3 positionBMeters, double arrivalDifferenceSeconds)
    {
        var d = (positionAMeters - positionBMeters).Length;
        var cosine = PhysicalConstants.SpeedOfLightMetersPerSecond * arrivalDifferenceSeconds / d;
        return d > 0 && Math.Abs(cosine) <= 1 ? double.RadiansToDegrees(Math.Acos(cosine)) : null;
    }
}
