using System.Text.Json;
using System.Text.Json.Serialization;

namespace EventReview.Core.Verdicts;

/// <summary>
/// Writes a <see cref="Judgement"/> as <c>{"verdict": "stored word", "reason": "..."}</c> whatever the serializer's enum
/// settings, and reads it back (a word no version of the record format used is refused).
/// </summary>
public sealed class JudgementJson : JsonConverter<Judgement>
{
    /// <inheritdoc />
    public override Judgement Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        if (reader.TokenType != JsonTokenType.StartObject)
        {
            throw new JsonException("A judgement must be a JSON object with \"verdict\" and \"reason\".");
        }

        string? word = null;
        var reason = string.Empty;
        while (reader.Read() && reader.TokenType != JsonTokenType.EndObject)
        {
            var name = reader.GetString();
            reader.Read();
            if (string.Equals(name, "verdict", StringComparison.OrdinalIgnoreCase))
            {
                word = reader.GetString();
            }
            else if (string.Equals(name, "reason", StringComparison.OrdinalIgnoreCase))
            {
                reason = reader.GetString() ?? string.Empty;
            }
            else
            {
                reader.Skip();
            }
        }

        return VerdictWords.TryParse(word, out var verdict)
            ? new Judgement(verdict, reason)
            : throw new JsonException($"'{word}' is not a verdict word of any record format.");
    }

    /// <inheritdoc />
    public override void Write(Utf8JsonWriter writer, Judgement value, JsonSerializerOptions options)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(value);
        writer.WriteStartObject();
        writer.WriteString(Name(options, "verdict"), value.Word);
        writer.WriteString(Name(options, "reason"), value.Reason);
        writer.WriteEndObject();
    }

    private static string Name(JsonSerializerOptions options, string name) => options.PropertyNamingPolicy?.ConvertName(name) ?? name;
}
