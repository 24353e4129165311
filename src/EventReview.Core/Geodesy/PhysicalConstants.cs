namespace EventReview.Core.Geodesy;

/// <summary>Physical constants used by the geometry code.</summary>
public static class PhysicalConstants
{
    /// <summary>Speed of light in vacuum, metres per second (exact by the SI definition of the metre).</summary>
    public const double SpeedOfLightMetersPerSecond = 299_792_458.0;
}
