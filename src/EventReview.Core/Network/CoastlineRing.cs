namespace EventReview.Core.Network;

/// <summary>One closed ring of the coastline: land, or a hole in land (a lake or inland sea).</summary>
/// <param name="IsHole">True for a hole.</param>
/// <param name="LongitudeDegrees">Longitudes east, degrees, in [−180, 180].</param>
/// <param name="LatitudeDegrees">Latitudes north, degrees, in [−90, 90].</param>
public sealed record CoastlineRing(bool IsHole, IReadOnlyList<double> LongitudeDegrees, IReadOnlyList<double> LatitudeDegrees);
