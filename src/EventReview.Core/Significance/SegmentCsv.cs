using EventReview.Core.Imports;

namespace EventReview.Core.Significance;

/// <summary>
/// Reads a site's analysed time: a CSV with the header columns <c>start_gps,end_gps</c> (any order,
/// extra columns ignored), one half-open segment [start, end) per row, GPS seconds to the nanosecond.
/// A row with end &lt;= start is rejected; overlapping or touching segments are merged and counted.
/// </summary>
public static class SegmentCsv
{
    private static readonly string[] Required = ["start_gps", "end_gps"];

    /// <summary>Parses and merges segments.</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="source">A name for error messages.</param>
    /// <exception cref="CsvFormatException">Naming the file, line and column of the first bad row.</exception>
    public static SegmentImport Parse(TextReader reader, string source = "segments")
    {
        var raw = new List<Segment>();
        foreach (var row in CsvTable.Read(reader, source, Required))
        {
            var start = row.Gps("start_gps");
            var end = row.Gps("end_gps");
            if (end <= start)
            {
                throw row.Error("end_gps", $"the segment ends ({end}) at or before it starts ({start})");
            }

            raw.Add(new Segment(start, end));
        }

        var merged = SegmentList.Merge(raw, out var mergedCount);
        return new SegmentImport(merged, raw.Count, mergedCount);
    }

    /// <summary>Reads and parses a segment file.</summary>
    public static SegmentImport Load(string path)
    {
        using var reader = new StreamReader(path);
        return Parse(reader, Path.GetFileName(path));
    }
}
