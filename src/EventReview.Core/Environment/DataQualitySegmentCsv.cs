using EventReview.Core.Imports;

namespace EventReview.Core.Environment;

/// <summary>
/// Imports data-quality segments from CSV with header <c>site,flag,start_gps,end_gps[,comment]</c>.
/// Rows with end &lt;= start are rejected; overlapping or touching rows of the same site and flag are merged
/// (comments joined with "; ") and each merge is reported in <see cref="DataQualitySegmentImport.Notes"/>.
/// </summary>
public static class DataQualitySegmentCsv
{
    /// <summary>Parses and validates the whole file; nothing is returned when any line is bad.</summary>
    /// <param name="reader">CSV text.</param>
    /// <param name="knownSites">Site codes of the network; null accepts any well-formed code.</param>
    /// <exception cref="CsvFormatException">Naming the line (and column) of the first bad row.</exception>
    public static DataQualitySegmentImport Parse(TextReader reader, IReadOnlyCollection<string>? knownSites)
    {
        var rows = CsvTable.Read(reader, "site", "flag", "start_gps", "end_gps");
        var parsed = new List<(DataQualitySegment Segment, int Line)>();
        foreach (var row in rows)
        {
            var site = SiteCodes.Read(row, knownSites);
            var flag = row.Text("flag");
            var start = row.Gps("start_gps");
            var end = row.Gps("end_gps");
            if (end <= start)
            {
                throw row.Error("end_gps", $"end {end} must be after start {start}");
            }

            parsed.Add((new DataQualitySegment(site, flag, start, end, row.Optional("comment")), row.LineNumber));
        }

        var notes = new List<string>();
        var merged = new List<DataQualitySegment>();
        foreach (var group in parsed.GroupBy(p => (p.Segment.Site, p.Segment.Flag)).OrderBy(g => g.Key.Site, StringComparer.Ordinal).ThenBy(g => g.Key.Flag, StringComparer.Ordinal))
        {
            var ordered = group.OrderBy(p => p.Segment.Start).ToList();
            var current = ordered[0].Segment;
            var lines = new List<int> { ordered[0].Line };
            foreach (var (segment, line) in ordered.Skip(1))
            {
                if (segment.Start <= current.End)
                {
                    current = current with
                    {
                        End = segment.End > current.End ? segment.End : current.End,
                        Comment = JoinComments(current.Comment, segment.Comment),
                    };
                    lines.Add(line);
                    continue;
                }

                Flush(current, lines, merged, notes);
                current = segment;
                lines = [line];
            }

            Flush(current, lines, merged, notes);
        }

        return new DataQualitySegmentImport(merged, notes);
    }

    private static void Flush(DataQualitySegment segment, List<int> lines, List<DataQualitySegment> merged, List<string> notes)
    {
        merged.Add(segment);
        if (lines.Count > 1)
        {
            notes.Add($"lines {string.Join(", ", lines.Order())}: overlapping segments of site {segment.Site} flag '{segment.Flag}' merged into [{segment.Start}, {segment.End})");
        }
    }

    private static string? JoinComments(string? a, string? b) =>
        a is null ? b : b is null || b == a ? a : a + "; " + b;
}
