namespace EventReview.Core.Environment;

/// <summary>Result of importing a data-quality segment file.</summary>
/// <param name="Segments">Segments sorted by site, flag and start, with overlapping rows of the same site and flag merged.</param>
/// <param name="Notes">One human-readable line per merge ("lines 3 and 5: ... merged"), empty when nothing was merged.</param>
public sealed record DataQualitySegmentImport(IReadOnlyList<DataQualitySegment> Segments, IReadOnlyList<string> Notes);
