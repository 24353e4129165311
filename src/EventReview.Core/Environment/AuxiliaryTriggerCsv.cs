using EventReview.Core.Imports;

namespace EventReview.Core.Environment;

/// <summary>
/// Imports auxiliary and environmental triggers from CSV with header <c>site,channel,gps_time,snr[,frequency_hz,duration_s]</c>.
/// SNR must be &gt;= 0, frequency &gt; 0 and duration &gt;= 0 when given.
/// </summary>
public static class AuxiliaryTriggerCsv
{
    /// <summary>Parses and validates the whole file, returning triggers sorted by time.</summary>
    /// <param name="reader">CSV text.</param>
    /// <param name="knownSites">Site codes of the network; null accepts any well-formed code.</param>
    /// <exception cref="CsvFormatException">Naming the line (and column) of the first bad row.</exception>
    public static IReadOnlyList<AuxiliaryTrigger> Parse(TextReader reader, IReadOnlyCollection<string>? knownSites)
    {
        var list = new List<AuxiliaryTrigger>();
        foreach (var row in CsvTable.Read(reader, "site", "channel", "gps_time", "snr"))
        {
            var site = SiteCodes.Read(row, knownSites);
            var snr = row.Number("snr");
            if (snr < 0)
            {
                throw row.Error("snr", "SNR must be >= 0");
            }

            var f = row.OptionalNumber("frequency_hz");
            if (f is <= 0)
            {
                throw row.Error("frequency_hz", "frequency must be > 0 Hz");
            }

            var d = row.OptionalNumber("duration_s");
            if (d is < 0)
            {
                throw row.Error("duration_s", "duration must be >= 0 s");
            }

            list.Add(new AuxiliaryTrigger(site, row.Text("channel"), row.Gps("gps_time"), snr, f, d));
        }

        return list.OrderBy(t => t.Time).ToList();
    }
}
