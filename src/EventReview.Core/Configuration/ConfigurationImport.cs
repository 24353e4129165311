using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace EventReview.Core.Configuration;

/// <summary>
/// Reads a configuration snapshot's items from a file: either <c>key = value</c> lines or a JSON object.
/// <para>
/// Lines format: one <c>key = value</c> per line; keys match <c>[A-Za-z0-9_.:/-]+</c>; blank lines and lines whose
/// first non-space character is <c>#</c> are ignored; spaces around key and value are trimmed; the value is the rest
/// of the line after the first <c>=</c> (it may itself contain <c>=</c>). A repeated key or a line without <c>=</c> is an error.
/// </para>
/// <para>
/// JSON format (detected when the first non-space character is <c>{</c>): nested objects are flattened with dots
/// (<c>{"a":{"b":1}}</c> gives <c>a.b = 1</c>), arrays with <c>[i]</c> (<c>a[0]</c>, <c>a[1]</c>); numbers keep their JSON
/// text exactly; <c>true</c>/<c>false</c>/<c>null</c> become those words; strings their value. Empty objects and arrays
/// produce no key. NaN, Infinity and invalid JSON are errors.
/// </para>
/// Limits: at most <see cref="MaxKeys"/> keys, keys of at most <see cref="MaxKeyLength"/> characters, values of at most
/// <see cref="MaxValueLength"/> characters. Every error is a <see cref="FormatException"/> naming the file and line.
/// </summary>
public static partial class ConfigurationImport
{
    /// <summary>Largest number of items a snapshot may hold.</summary>
    public const int MaxKeys = 100_000;

    /// <summary>Longest key, characters.</summary>
    public const int MaxKeyLength = 200;

    /// <summary>Longest value, characters.</summary>
    public const int MaxValueLength = 10_000;

    /// <summary>Parses <paramref name="text"/>; <paramref name="fileName"/> is used in error messages only.</summary>
    /// <returns>The items, sorted by key in ordinal order.</returns>
    /// <exception cref="FormatException">When the file breaks a rule above (the message names the line).</exception>
    public static IReadOnlyDictionary<string, string> Parse(string text, string fileName)
    {
        ArgumentNullException.ThrowIfNull(text);
        var trimmed = text.TrimStart('\uFEFF', ' ', '\t', '\r', '\n');
        return trimmed.StartsWith('{') ? ParseJson(text, fileName) : ParseLines(text, fileName);
    }

    /// <summary>True when <paramref name="key"/> is a valid item key (pattern and length).</summary>
    /// <remarks>Array indices <c>[i]</c> produced by JSON flattening are allowed after a name part.</remarks>
    public static bool IsValidKey(string? key)
    {
        if (key is not { Length: > 0 and <= MaxKeyLength })
        {
            return false;
        }

        var plain = IndexPattern().Replace(key, string.Empty);
        return plain.Length > 0 && KeyPattern().IsMatch(plain);
    }

    private static SortedDictionary<string, string> ParseLines(string text, string fileName)
    {
        var items = new SortedDictionary<string, string>(StringComparer.Ordinal);
        var firstLine = new Dictionary<string, int>(StringComparer.Ordinal);
        var lineNo = 0;
        using var reader = new StringReader(text);
        while (reader.ReadLine() is { } raw)
        {
            lineNo++;
            var line = lineNo == 1 ? raw.TrimStart('\uFEFF') : raw;
            var t = line.Trim();
            if (t.Length == 0 || t[0] == '#')
            {
                continue;
            }

            var eq = t.IndexOf('=');
            if (eq < 0)
            {
                throw new FormatException($"{fileName}, line {lineNo}: expected 'key = value' but found no '='.");
            }

            var key = t[..eq].Trim();
            var value = t[(eq + 1)..].Trim();
            CheckKey(key, fileName, lineNo);
            CheckValue(key, value, fileName, lineNo);
            if (firstLine.TryGetValue(key, out var earlier))
            {
                throw new FormatException($"{fileName}, line {lineNo}: key '{key}' already appears on line {earlier}.");
            }

            firstLine[key] = lineNo;
            items[key] = value;
            CheckCount(items.Count, fileName, lineNo);
        }

        return items;
    }

    private static SortedDictionary<string, string> ParseJson(string text, string fileName)
    {
        var bytes = Encoding.UTF8.GetBytes(text);
        var items = new SortedDictionary<string, string>(StringComparer.Ordinal);
        var frames = new Stack<Frame>();
        string? name = null;
        var line = 1;
        var counted = 0L;
        var reader = new Utf8JsonReader(bytes, new JsonReaderOptions { MaxDepth = 64, CommentHandling = JsonCommentHandling.Disallow });
        try
        {
            while (reader.Read())
            {
                // Line of the current token, counted incrementally (1-based).
                for (; counted < reader.TokenStartIndex; counted++)
                {
                    if (bytes[counted] == (byte)'\n')
                    {
                        line++;
                    }
                }

                switch (reader.TokenType)
                {
                    case JsonTokenType.PropertyName:
                        name = reader.GetString();
                        break;
                    case JsonTokenType.StartObject:
                    case JsonTokenType.StartArray:
                        var isArray = reader.TokenType == JsonTokenType.StartArray;
                        if (frames.Count == 0)
                        {
                            if (isArray)
                            {
                                throw new FormatException($"{fileName}, line {line}: the JSON must be an object of items, not an array.");
                            }

                            frames.Push(new Frame(string.Empty, false));
                        }
                        else
                        {
                            frames.Push(new Frame(NextKey(frames.Peek(), name), isArray));
                        }

                        break;
                    case JsonTokenType.EndObject:
                    case JsonTokenType.EndArray:
                        frames.Pop();
                        break;
                    default:
                        var key = NextKey(frames.Peek(), name);
                        var value = reader.TokenType switch
                        {
                            JsonTokenType.String => reader.GetString() ?? string.Empty,
                            JsonTokenType.Number => Encoding.UTF8.GetString(reader.ValueSpan),
                            JsonTokenType.True => "true",
                            JsonTokenType.False => "false",
                            _ => "null",
                        };
                        Add(key, value, items, fileName, line);
                        break;
                }
            }
        }
        catch (JsonException ex)
        {
            var at = ex.LineNumber is { } l ? (l + 1).ToString(CultureInfo.InvariantCulture) : "?";
            throw new FormatException($"{fileName}, line {at}: invalid JSON (NaN, Infinity, comments and trailing text are not allowed): {FirstSentence(ex.Message)}");
        }

        return items;
    }

    private static string NextKey(Frame parent, string? name)
    {
        if (parent.IsArray)
        {
            return $"{parent.Prefix}[{(parent.Index++).ToString(CultureInfo.InvariantCulture)}]";
        }

        return parent.Prefix.Length == 0 ? name ?? string.Empty : parent.Prefix + "." + name;
    }

    private static void Add(string key, string value, SortedDictionary<string, string> items, string fileName, int line)
    {
        if (!IsValidKey(key))
        {
            throw new FormatException($"{fileName}, line {line}: key '{Shorten(key)}' is empty, longer than {MaxKeyLength} characters or uses characters outside A-Z a-z 0-9 _ . : / -.");
        }

        CheckValue(key, value, fileName, line);
        if (!items.TryAdd(key, value))
        {
            throw new FormatException($"{fileName}, line {line}: key '{Shorten(key)}' appears twice after flattening.");
        }

        CheckCount(items.Count, fileName, line);
    }

    private static void CheckKey(string key, string fileName, int lineNo)
    {
        if (key.Length == 0)
        {
            throw new FormatException($"{fileName}, line {lineNo}: the key before '=' is empty.");
        }

        if (key.Length > MaxKeyLength)
        {
            throw new FormatException($"{fileName}, line {lineNo}: key '{Shorten(key)}' is longer than {MaxKeyLength} characters.");
        }

        if (!KeyPattern().IsMatch(key))
        {
            throw new FormatException($"{fileName}, line {lineNo}: key '{Shorten(key)}' may use only letters A-Z a-z, digits and _ . : / -.");
        }
    }

    private static void CheckValue(string key, string value, string fileName, int lineNo)
    {
        if (value.Length > MaxValueLength)
        {
            throw new FormatException($"{fileName}, line {lineNo}: the value of '{key}' is longer than {MaxValueLength} characters.");
        }
    }

    private static void CheckCount(int count, string fileName, int lineNo)
    {
        if (count > MaxKeys)
        {
            throw new FormatException($"{fileName}, line {lineNo}: more than {MaxKeys} items.");
        }
    }

    private static string FirstSentence(string message)
    {
        var i = message.IndexOf(". ", StringComparison.Ordinal);
        return i > 0 ? message[..(i + 1)] : message;
    }

    private static string Shorten(string s) => s.Length > 60 ? s[..60] + "..." : s;

    [GeneratedRegex("^[A-Za-z0-9_.:/-]+$")]
    private static partial Regex KeyPattern();

    [GeneratedRegex(@"\[\d+\]")]
    private static partial Regex IndexPattern();

    private sealed class Frame(string prefix, bool isArray)
    {
        public string Prefix { get; } = prefix;

        public bool IsArray { get; } = isArray;

        public int Index { get; set; }
    }
}
