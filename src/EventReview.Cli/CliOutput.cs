using System.Text.Json;
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

    /// <summary>Writes a one-line message to standard error and returns exit code 2.</summary>
    public static int Fail(string message)
    {
        Console.Error.WriteLine("error: " + message.ReplaceLineEndings(" "));
        return BadInput;
    }
}
