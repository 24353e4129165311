namespace EventReview.Core.Geodesy;

/// <summary>A WGS-84 geodetic position: latitude and longitude in degrees (north, east positive), ellipsoidal height in metres.</summary>
public readonly record struct GeodeticPosition(double LatitudeDegrees, double LongitudeDegrees, double HeightMeters);
