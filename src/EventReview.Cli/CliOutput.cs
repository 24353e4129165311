using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.Json.Serialization;

namespace EventReview.Cli;

/// <summary>Shared output conventions: camelCase JSON, exit code 0 success, 1 a negative result (e.g. "invalid"), 2 bad input.</summary>
public static class CliOutput
{
    public const int Success = 0;
    public const int Negative = 1;
    public const int BadInput = 2;

    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web)
    {
        WriteIndented = true,
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };

    /// <summary>Writes a value as camelCase JSON to standard output.</summary>
    public static void WriteJson<T>(T value) => Console.Out.WriteLine(JsonSerializer.Serialize(value, Json));

    /// <summary>
    /// Writes a value as camelCase JSON in which every Core judgement is flattened into its owner: an object holding
    /// <c>"judgement": {"verdict", "reason"}</c> gets <c>"verdict"</c> and <c>"reason"</c> of its own instead, so that a
    /// result, each of its stages or channels, and each site say their verdict in the same two fields.
    /// </summary>
    public static void WriteJsonWithVerdicts<T>(T value)
    {
        var node = JsonSerializer.SerializeToNode(value, Json);
        Flatten(node);
        Console.Out.WriteLine(node?.ToJsonString(Json) ?? "null");
    }

    private static void Flatten(JsonNode? node)
    {
        switch (node)
        {
            case JsonObject o:
                if (o["judgement"] is JsonObject j)
                {
                    o.Remove("judgement");
                    o["verdict"] = j["verdict"]?.DeepClone();
                    o["reason"] = j["reason"]?.DeepClone();
                }

                foreach (var child in o.Select(kv => kv.Value).ToList())
                {
                    Flatten(child);
                }

                break;
            case JsonArray a:
                foreach (var child in a)
                {
                    Flatten(child);
                }

                break;
        }
    }

    /// <summary>Writes a one-line message to standard error and returns exit code 2.</summary>
    public static int Fail(string message)
    {
        Console.Error.WriteLine("error: " + message.ReplaceLineEndings(" "));
        return BadInput;
    }
}
