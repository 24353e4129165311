using System.Text;
using System.Text.Json;

namespace EventReview.Web.Services;

/// <summary>
/// Stored JSON made readable for the "Parameters and full result" view: objects indented two spaces a level, arrays of plain
/// values (long numeric series) kept on one line, strings unescaped for reading ("+", "σ", "×" as themselves, not \u002B).
/// Display only: the stored text, which the record's hashes cover, is not changed.
/// </summary>
public static class PrettyJson
{
    /// <summary><paramref name="json"/> laid out for reading; the text itself when it is not valid JSON.</summary>
    public static string Format(string json)
    {
        ArgumentNullException.ThrowIfNull(json);
        try
        {
            using var doc = JsonDocument.Parse(json);
            var sb = new StringBuilder(json.Length + (json.Length / 4));
            Write(sb, doc.RootElement, 0);
            return sb.ToString();
        }
        catch (JsonException)
        {
            return json;
        }
    }

    private static void Write(StringBuilder sb, JsonElement e, int depth)
    {
        switch (e.ValueKind)
        {
            case JsonValueKind.Object:
                if (!e.EnumerateObject().Any())
                {
                    sb.Append("{}");
                    return;
                }

                sb.Append("{\n");
                var first = true;
                foreach (var p in e.EnumerateObject())
                {
                    if (!first)
                    {
                        sb.Append(",\n");
                    }

                    first = false;
                    sb.Append(' ', (depth + 1) * 2).Append(Quote(p.Name)).Append(": ");
                    Write(sb, p.Value, depth + 1);
                }

                sb.Append('\n').Append(' ', depth * 2).Append('}');
                return;
            case JsonValueKind.Array:
                var items = e.EnumerateArray().ToList();
                if (items.All(i => i.ValueKind is not (JsonValueKind.Object or JsonValueKind.Array)))
                {
                    sb.Append('[').AppendJoin(", ", items.Select(Plain)).Append(']');
                    return;
                }

                sb.Append("[\n");
                for (var k = 0; k < items.Count; k++)
                {
                    sb.Append(' ', (depth + 1) * 2);
                    Write(sb, items[k], depth + 1);
                    sb.Append(k < items.Count - 1 ? ",\n" : "\n");
                }

                sb.Append(' ', depth * 2).Append(']');
                return;
            default:
                sb.Append(Plain(e));
                return;
        }
    }

    private static string Plain(JsonElement e) => e.ValueKind == JsonValueKind.String ? Quote(e.GetString()!) : e.GetRawText();

    private static string Quote(string s) => "\"" + s.Replace("\\", "\\\\", StringComparison.Ordinal).Replace("\"", "\\\"", StringComparison.Ordinal)
        .Replace("\n", "\\n", StringComparison.Ordinal).Replace("\r", "\\r", StringComparison.Ordinal).Replace("\t", "\\t", StringComparison.Ordinal) + "\"";
}
