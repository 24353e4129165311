using EventReview.Core.Imports;

namespace EventReview.Core.Injections;

/// <summary>
/// Imports an injection log from CSV with header <c>site,start_gps,end_gps,kind,waveform_ref,status</c>, status one of
/// scheduled, performed, aborted (case-insensitive). end_gps must be &gt;= start_gps. The same format is the
/// canonical content of a sealed blind-injection record (see <see cref="BlindInjectionRecord"/>).
/// </summary>
public static class InjectionLogCsv
{
    /// <summary>Parses and validates the whole log, returning records sorted by start time.</summary>
    /// <param name="reader">CSV text.</param>
    /// <param name="knownSites">Site codes of the network; null accepts any well-formed code.</param>
    /// <exception cref="CsvFormatException">Naming the line (and column) of the first bad row.</exception>
    public static IReadOnlyList<InjectionRecord> Parse(TextReader reader, IReadOnlyCollection<string>? knownSites)
    {
        var list = new List<InjectionRecord>();
        foreach (var row in CsvTable.Read(reader, "site", "start_gps", "end_gps", "kind", "waveform_ref", "status"))
        {
            var site = SiteCodes.Read(row, knownSites);
            var start = row.Gps("start_gps");
            var end = row.Gps("end_gps");
            if (end < start)
            {
                throw row.Error("end_gps", $"end {end} must not be before start {start}");
            }

            var statusText = row.Text("status");
            if (!Enum.TryParse<InjectionStatus>(statusText, ignoreCase: true, out var status) || !Enum.IsDefined(status) || int.TryParse(statusText, out _))
            {
                throw row.Error("status", $"'{statusText}' is not one of scheduled, performed, aborted");
            }

            list.Add(new InjectionRecord(site, start, end, row.Text("kind"), row.Text("waveform_ref"), status));
        }

        return list.OrderBy(r => r.Start).ToList();
    }
}
