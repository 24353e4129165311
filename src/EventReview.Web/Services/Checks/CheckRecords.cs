using System.Reflection;
using System.Text.Json;
using System.Text.Json.Serialization;
using EventReview.Core.Evidence;

namespace EventReview.Web.Services.Checks;

/// <summary>Conventions shared by every built-in check: JSON form, tool version, input fingerprints.</summary>
public static class CheckRecords
{
    /// <summary>Canonical camelCase JSON (no indentation, fixed property order from the records) for parameters, inputs and results.</summary>
    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web)
    {
        WriteIndented = false,
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase) },
    };

    /// <summary>Version of the computing code, recorded on every computation record.</summary>
    public static string ToolVersion { get; } = "eventreview-core " +
        (typeof(Core.Timing.TimingCheck).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion?.Split('+')[0] ?? "0");

    public static string Serialize<T>(T value) => JsonSerializer.Serialize(value, Json);

    /// <summary>SHA-256 of the canonical JSON of the inputs.</summary>
    public static string Fingerprint<T>(T inputs) => Hashing.Sha256Hex(Serialize(inputs));

    /// <summary>The record format of a stored result: its "format" property, or 1 when it has none (or is not an object).</summary>
    public static int FormatOf(string resultJson)
    {
        try
        {
            using var doc = JsonDocument.Parse(resultJson);
            return doc.RootElement.ValueKind == JsonValueKind.Object && doc.RootElement.TryGetProperty("format", out var f) && f.TryGetInt32(out var v)
                ? Core.Verdicts.RecordFormat.Of(v)
                : Core.Verdicts.RecordFormat.Legacy;
        }
        catch (JsonException)
        {
            return Core.Verdicts.RecordFormat.Legacy;
        }
    }

    /// <summary>Separator between SVG pictures in <see cref="ComputationRecord.PicturesSvg"/>.</summary>
    public const string PictureSeparator = "<!--next-->";
}
