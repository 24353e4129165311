namespace EventReview.Core.Time;

/// <summary>A sky direction in equatorial coordinates, degrees: right ascension in [0, 360), declination in [-90, 90] (mean-of-date when made by <see cref="SkyFrame"/>).</summary>
public readonly record struct EquatorialDirection(double RaDegrees, double DecDegrees);
