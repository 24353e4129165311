using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace EventReview.Core.Dossier;

/// <summary>
/// The JSON conventions of <c>dossier.json</c> and <c>manifest.json</c>: camelCase, indented with two spaces, '\n'
/// line ends, UTF-8 without byte-order mark, non-ASCII letters unescaped, nulls written, a final '\n'.
/// Reading requires every non-nullable field.
/// </summary>
public static class DossierJson
{
    /// <summary>Serializer options used for writing and reading.</summary>
    public static JsonSerializerOptions Options { get; } = new(JsonSerializerDefaults.Web)
    {
        WriteIndented = true,
        NewLine = "\n",
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,
        RespectNullableAnnotations = true,
        RespectRequiredConstructorParameters = true,
        MaxDepth = 64,
    };

    /// <summary>UTF-8 bytes of <paramref name="value"/> followed by '\n'.</summary>
    public static byte[] Serialize<T>(T value)
    {
        var bytes = JsonSerializer.SerializeToUtf8Bytes(value, Options);
        var withNewLine = new byte[bytes.Length + 1];
        bytes.CopyTo(withNewLine, 0);
        withNewLine[^1] = (byte)'\n';
        return withNewLine;
    }

    /// <summary>Reads a value; throws <see cref="JsonException"/> when the text is not valid for <typeparamref name="T"/>.</summary>
    public static T Deserialize<T>(byte[] utf8) =>
        JsonSerializer.Deserialize<T>(utf8, Options) ?? throw new JsonException("The document is null.");
}
