namespace EventReview.Core.Environment;

/// <summary>A data-quality segment active inside a site's window.</summary>
/// <param name="Site">Site code.</param>
/// <param name="Flag">Flag name.</param>
/// <param name="StartGps">Start, GPS seconds.</param>
/// <param name="EndGps">End, GPS seconds.</param>
/// <param name="Comment">Comment from the file, or null.</param>
public sealed record ActiveSegment(string Site, string Flag, double StartGps, double EndGps, string? Comment);
