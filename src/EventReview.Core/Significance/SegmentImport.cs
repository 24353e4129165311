namespace EventReview.Core.Significance;

/// <summary>Segments read from a file, after merging.</summary>
/// <param name="Segments">Sorted, disjoint analysed-time segments.</param>
/// <param name="RowsRead">Number of segment rows in the file.</param>
/// <param name="MergedCount">Rows absorbed into a neighbour because they overlapped or touched it.</param>
public sealed record SegmentImport(IReadOnlyList<Segment> Segments, int RowsRead, int MergedCount);
