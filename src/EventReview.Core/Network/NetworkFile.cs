using System.Text.Json;
using EventReview.Core.Inputs;

namespace EventReview.Core.Network;

/// <summary>
/// Reads and writes the network file format (camelCase JSON, see <see cref="NetworkFileDocument"/>). Every site is built through the
/// validating <see cref="Site"/> constructor; errors name the site index and field ("sites[2].latitudeDegrees: ...").
/// </summary>
public static class NetworkFile
{
    private static readonly JsonSerializerOptions Options = new(JsonSerializerDefaults.Web) { WriteIndented = true };

    /// <summary>Parses network JSON text.</summary>
    /// <exception cref="FormatException">When the JSON is malformed (with its line), a field is missing or invalid (with the site index and field), or site codes repeat.</exception>
    public static NetworkDefinition Parse(string json)
    {
        ArgumentNullException.ThrowIfNull(json);
        NetworkFileDocument? document;
        try
        {
            document = JsonSerializer.Deserialize<NetworkFileDocument>(json, Options);
        }
        catch (JsonException ex)
        {
            throw new FormatException($"Network file is not valid JSON (line {(ex.LineNumber ?? 0) + 1}): {ex.Message}", ex);
        }

        if (document is null)
        {
            throw new FormatException("Network file is empty.");
        }

        if (string.IsNullOrWhiteSpace(document.Name))
        {
            throw new FormatException("name: the network needs a name.");
        }

        if (document.Sites is null || document.Sites.Count == 0)
        {
            throw new FormatException("sites: the network needs at least one site.");
        }

        var sites = new List<Site>();
        var codes = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        for (var i = 0; i < document.Sites.Count; i++)
        {
            var site = ToSite(document.Sites[i], i);
            if (!codes.Add(site.Code))
            {
                throw new FormatException($"sites[{i}].code: site code '{site.Code}' appears twice.");
            }

            sites.Add(site);
        }

        return new NetworkDefinition(document.Name.Trim(), sites);
    }

    /// <summary>Reads a network file from disk (UTF-8).</summary>
    public static NetworkDefinition Read(string path) => Parse(File.ReadAllText(path));

    /// <summary>Writes a network as indented camelCase JSON in the same format.</summary>
    public static string Write(NetworkDefinition network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var document = new NetworkFileDocument(network.Name, network.Sites.Select(s => new NetworkFileSite(
            s.Code, s.Name, s.LatitudeDegrees, s.LongitudeDegrees, s.HeightMeters, s.XArmAzimuthDegrees, s.YArmAzimuthDegrees,
            s.TimingUncertaintySeconds)).ToList());
        return JsonSerializer.Serialize(document, Options);
    }

    private static Site ToSite(NetworkFileSite? s, int index)
    {
        if (s is null)
        {
            throw new FormatException($"sites[{index}]: expected a site object.");
        }

        double Need(double? value, string field) =>
            value ?? throw new FormatException($"sites[{index}].{field}: missing.");

        try
        {
            return new Site(
                s.Code ?? throw new FormatException($"sites[{index}].code: missing."),
                s.Name ?? throw new FormatException($"sites[{index}].name: missing."),
                Need(s.LatitudeDegrees, "latitudeDegrees"),
                Need(s.LongitudeDegrees, "longitudeDegrees"),
                Need(s.HeightMeters, "heightMeters"),
                Need(s.XArmAzimuthDegrees, "xArmAzimuthDegrees"),
                Need(s.YArmAzimuthDegrees, "yArmAzimuthDegrees"),
                Need(s.TimingUncertaintySeconds, "timingUncertaintySeconds"));
        }
        catch (ArgumentOutOfRangeException ex)
        {
            var message = UserMessage.From(ex).Split(System.Environment.NewLine)[0];
            throw new FormatException($"sites[{index}].{ex.ParamName}: {message}", ex);
        }
    }
}
