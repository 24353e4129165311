using System.Diagnostics.CodeAnalysis;
using System.Reflection;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace EventReview.Core.Evidence;

/// <summary>
/// Conventions shared by every built-in check, in one place for the app and the CLI: the JSON form of parameters, inputs and
/// results, the tool version written on every computation record, input fingerprints, and the "same inputs" rule that makes a
/// re-run with nothing changed add no record.
/// </summary>
public static class CheckRecords
{
    /// <summary>Canonical camelCase JSON (no indentation, fixed property order from the records) for parameters, inputs and results.</summary>
    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web)
    {
        WriteIndented = false,
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase) },
    };

    /// <summary>Version of the computing code and of the record format, recorded on every computation record (at most 64 characters).</summary>
    public static string ToolVersion { get; } = "eventreview-core " +
        (typeof(CheckRecords).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion?.Split('+')[0] ?? "0")
        + $" (record format {Verdicts.RecordFormat.Current})";

    /// <summary>The record format of a stored result: its "format" property, or 1 when it has none (or is not an object).</summary>
    public static int FormatOf(string resultJson)
    {
        try
        {
            using var doc = JsonDocument.Parse(resultJson);
            return doc.RootElement.ValueKind == JsonValueKind.Object && doc.RootElement.TryGetProperty("format", out var f) && f.TryGetInt32(out var v)
                ? Verdicts.RecordFormat.Of(v)
                : Verdicts.RecordFormat.Legacy;
        }
        catch (JsonException)
        {
            return Verdicts.RecordFormat.Legacy;
        }
    }

    /// <summary>Separator between SVG pictures in <see cref="ComputationRecord.PicturesSvg"/>.</summary>
    public const string PictureSeparator = "<!--next-->";

    /// <summary>Canonical JSON of <paramref name="value"/> (see <see cref="Json"/>).</summary>
    public static string Serialize<T>(T value) => JsonSerializer.Serialize(value, Json);

    /// <summary>SHA-256 (lowercase hex) of the canonical JSON of the inputs.</summary>
    public static string Fingerprint<T>(T inputs) => Hashing.Sha256Hex(Serialize(inputs));

    /// <summary>The newest record of <paramref name="kind"/> among <paramref name="records"/> (by run time, then id), or null.</summary>
    public static ComputationRecord? Latest(IEnumerable<ComputationRecord> records, string kind)
    {
        ArgumentNullException.ThrowIfNull(records);
        return records.Where(r => r.Kind == kind).OrderByDescending(r => r.RunAt).ThenByDescending(r => r.Id).FirstOrDefault();
    }

    /// <summary>
    /// The "same inputs" rule: true when <paramref name="latest"/> exists and has the same input fingerprint, the same parameters
    /// JSON and the same tool version as a run about to be made, so the run would add nothing and is skipped.
    /// </summary>
    public static bool SameRun([NotNullWhen(true)] ComputationRecord? latest, string inputFingerprint, string parametersJson) =>
        latest is not null
        && latest.InputFingerprint == inputFingerprint
        && latest.ParametersJson == parametersJson
        && latest.ToolVersion == ToolVersion;
}
