using EventReview.Core.Imports;

namespace EventReview.Core.Environment;

/// <summary>
/// Imports a sensor inventory from CSV with header <c>site,channel,kind,location[,coupling_file,data_file]</c>; kind is one of
/// seismic, acoustic, magnetic, radio, weather, power, instrument, other (case-insensitive). A (site, channel) pair may appear once.
/// </summary>
public static class SensorInventoryCsv
{
    /// <summary>Parses and validates the whole file.</summary>
    /// <param name="reader">CSV text.</param>
    /// <param name="knownSites">Site codes of the network; null accepts any well-formed code.</param>
    /// <exception cref="CsvFormatException">Naming the line (and column) of the first bad row.</exception>
    public static IReadOnlyList<Sensor> Parse(TextReader reader, IReadOnlyCollection<string>? knownSites)
    {
        var list = new List<Sensor>();
        var seen = new HashSet<(string, string)>();
        foreach (var row in CsvTable.Read(reader, "site", "channel", "kind", "location"))
        {
            var site = SiteCodes.Read(row, knownSites);
            var channel = row.Text("channel");
            var kindText = row.Text("kind");
            if (!Enum.TryParse<SensorKind>(kindText, ignoreCase: true, out var kind) || !Enum.IsDefined(kind) || int.TryParse(kindText, out _))
            {
                throw row.Error("kind", $"'{kindText}' is not one of {string.Join(", ", Enum.GetNames<SensorKind>().Select(n => n.ToLowerInvariant()))}");
            }

            if (!seen.Add((site, channel)))
            {
                throw row.Error("channel", $"channel '{channel}' of site {site} is listed twice");
            }

            list.Add(new Sensor(site, channel, kind, row.Text("location"), row.Optional("coupling_file"), row.Optional("data_file")));
        }

        return list;
    }
}
