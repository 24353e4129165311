namespace EventReview.Web.Services.Checks;

/// <summary>What was read for one site: the files (name and hash), how many rows, and what was dropped and why.</summary>
/// <param name="SiteCode">Site code.</param>
/// <param name="TriggersFile">Trigger file name.</param>
/// <param name="TriggersSha256">Its SHA-256.</param>
/// <param name="TriggerRows">Trigger rows read.</param>
/// <param name="TriggersKept">Triggers inside the site's analysed segments (used).</param>
/// <param name="DroppedOutsideSegments">Triggers dropped because they lie outside every analysed segment.</param>
/// <param name="SegmentsFile">Segment file name.</param>
/// <param name="SegmentsSha256">Its SHA-256.</param>
/// <param name="SegmentRows">Segment rows read.</param>
/// <param name="SegmentsMerged">Rows merged into a neighbour because they overlapped or touched it.</param>
/// <param name="AnalysedSeconds">Total analysed time of the site after merging, in s.</param>
public sealed record BackgroundSiteInput(string SiteCode, string TriggersFile, string TriggersSha256, int TriggerRows, int TriggersKept, int DroppedOutsideSegments,
    string SegmentsFile, string SegmentsSha256, int SegmentRows, int SegmentsMerged, double AnalysedSeconds);
