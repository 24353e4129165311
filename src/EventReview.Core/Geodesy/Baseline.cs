using EventReview.Core.Network;

namespace EventReview.Core.Geodesy;

/// <summary>
/// The straight-line (chord) baseline between two sites: <see cref="VectorMeters"/> = r_a - r_b in ECEF metres,
/// its length, and the light-travel time length / c in seconds.
/// </summary>
public sealed record Baseline(string A, string B, Vector3 VectorMeters, double BaselineMeters, double LightTravelSeconds)
{
    /// <summary>Baseline from site a to site b (vector r_a - r_b, the axis of the sky ring).</summary>
    public static Baseline Between(Site a, Site b)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        var v = SiteGeometry.Position(a) - SiteGeometry.Position(b);
        var d = v.Length;
        return new Baseline(a.Code, b.Code, v, d, TravelSeconds(d));
    }

    /// <summary>Light-travel time d / c in seconds for a distance in metres.</summary>
    public static double TravelSeconds(double distanceMeters) => distanceMeters / PhysicalConstants.SpeedOfLightMetersPerSecond;
}
