namespace EventReview.Core.Antenna;

/// <summary>A rectangular cell of the RA/Dec map, degrees: centre, width in RA and height in Dec.</summary>
public sealed record SkyCell(double RaDegrees, double DecDegrees, double WidthDegrees, double HeightDegrees);
