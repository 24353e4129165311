using System.Globalization;
using System.Text.Json;

namespace EventReview.Web.Api;

/// <summary>Finds out whether a JSON body that failed to bind failed on a well-formed number too large for its field.</summary>
public static class JsonNumbers
{
    /// <summary>
    /// The raw text of the number at <paramref name="path"/> (as System.Text.Json reports it: <c>$.arrivals[0].snr</c>)
    /// when the body is well-formed JSON, a number sits there and the field of <paramref name="target"/> at that path is
    /// numeric (so the number failed only because the field cannot hold it); null otherwise (then the body is malformed).
    /// </summary>
    public static string? OutOfRange(byte[] body, string? path, Type target)
    {
        if (string.IsNullOrEmpty(path) || !path.StartsWith('$'))
        {
            return null;
        }

        try
        {
            using var doc = JsonDocument.Parse(body, new JsonDocumentOptions { MaxDepth = 64 });
            var node = doc.RootElement;
            var type = target;
            var rest = path.AsSpan(1);
            while (rest.Length > 0)
            {
                if (rest[0] == '.')
                {
                    var end = rest[1..].IndexOfAny('.', '[');
                    var name = (end < 0 ? rest[1..] : rest[1..(end + 1)]).ToString();
                    var property = type.GetProperties().FirstOrDefault(p => string.Equals(p.Name, name, StringComparison.OrdinalIgnoreCase));
                    if (property is null || node.ValueKind != JsonValueKind.Object || !TryProperty(node, name, out node))
                    {
                        return null;
                    }

                    type = property.PropertyType;
                    rest = end < 0 ? [] : rest[(end + 1)..];
                }
                else if (rest[0] == '[')
                {
                    var close = rest.IndexOf(']');
                    var element = ElementType(type);
                    if (element is null || close < 0 || !int.TryParse(rest[1..close], NumberStyles.None, CultureInfo.InvariantCulture, out var index) ||
                        node.ValueKind != JsonValueKind.Array || index >= node.GetArrayLength())
                    {
                        return null;
                    }

                    node = node[index];
                    type = element;
                    rest = rest[(close + 1)..];
                }
                else
                {
                    return null;
                }
            }

            return node.ValueKind == JsonValueKind.Number && IsNumeric(type) ? Shorten(node.GetRawText()) : null;
        }
        catch (JsonException)
        {
            return null;
        }
    }

    private static bool IsNumeric(Type type) =>
        (Nullable.GetUnderlyingType(type) ?? type) is var t &&
        (t == typeof(double) || t == typeof(float) || t == typeof(decimal) || t == typeof(int) || t == typeof(long) || t == typeof(short));

    private static Type? ElementType(Type type) => type.IsArray
        ? type.GetElementType()
        : type.GetInterfaces().Append(type).FirstOrDefault(i => i.IsGenericType && i.GetGenericTypeDefinition() == typeof(IEnumerable<>))?.GetGenericArguments()[0];

    // The serializer matches property names case-insensitively (web defaults); so does this.
    private static bool TryProperty(JsonElement node, string name, out JsonElement value)
    {
        foreach (var p in node.EnumerateObject())
        {
            if (string.Equals(p.Name, name, StringComparison.OrdinalIgnoreCase))
            {
                value = p.Value;
                return true;
            }
        }

        value = default;
        return false;
    }

    private static string Shorten(string raw) => raw.Length <= 40 ? raw : $"{raw[..20]}...({raw.Length} characters)";
}
