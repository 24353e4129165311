namespace EventReview.Core.Signal.Overlap;

/// <summary>One site's input to the overlap check kind: its code, the name of the strain file it came from, and the strain.</summary>
public sealed record OverlapReviewSite(string Code, string FileName, TimeSeries Strain);
