using EventReview.Core.Time;

namespace EventReview.Core.Environment;

/// <summary>
/// A data-quality flag active at one site over the half-open GPS interval [Start, End).
/// </summary>
/// <param name="Site">Upper-case site code.</param>
/// <param name="Flag">Flag name as written in the file.</param>
/// <param name="Start">First instant the flag is active.</param>
/// <param name="End">First instant after the flag (End &gt; Start).</param>
/// <param name="Comment">Free text from the file, or null.</param>
public sealed record DataQualitySegment(string Site, string Flag, GpsTime Start, GpsTime End, string? Comment)
{
    /// <summary>True when the segment intersects the closed interval [from, to].</summary>
    public bool Intersects(GpsTime from, GpsTime to) => Start <= to && End > from;
}
