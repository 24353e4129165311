using System.Text.Json;
using System.Text.Json.Serialization;

namespace EventReview.Core.Verdicts;

/// <summary>
/// Writes a <see cref="Verdict"/> as its stored word ("consistent", "not run") and reads it back, whatever enum naming the
/// serializer options use, so a verdict inside a record's JSON and in the CLI's <c>--json</c> is the same word.
/// </summary>
public sealed class VerdictJsonConverter : JsonConverter<Verdict>
{
    /// <inheritdoc />
    public override Verdict Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        var word = reader.TokenType == JsonTokenType.String ? reader.GetString() : null;
        return VerdictWords.TryParse(word, out var verdict)
            ? verdict
            : throw new JsonException($"'{word}' is not a verdict word of any record format.");
    }

    /// <inheritdoc />
    public override void Write(Utf8JsonWriter writer, Verdict value, JsonSerializerOptions options)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.WriteStringValue(VerdictWords.Word(value));
    }
}
