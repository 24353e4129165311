using System.Globalization;
using System.Text;

namespace EventReview.Core.Records;

/// <summary>
/// The stored form of an entry's facts (format <c>eventreview-facts-v1</c>): one fact per line, <c>name=value</c>,
/// lines joined by '\n' without a trailing newline; in values a backslash is written <c>\\</c>, a line feed <c>\n</c>
/// and a carriage return <c>\r</c>. Names never hold '=' or a line break. No facts is the empty string. The text is
/// covered by the entry's hash as stored, so parsing never needs to reproduce it.
/// </summary>
public static class FactText
{
    /// <summary>The stored text of <paramref name="facts"/>, in the order given.</summary>
    /// <exception cref="ArgumentException">When a name is empty or holds '=' or a line break.</exception>
    public static string Format(IEnumerable<Fact> facts)
    {
        ArgumentNullException.ThrowIfNull(facts);
        var sb = new StringBuilder();
        foreach (var f in facts)
        {
            if (string.IsNullOrEmpty(f.Name) || f.Name.AsSpan().IndexOfAny('=', '\n', '\r') >= 0)
            {
                throw new ArgumentException($"Fact name '{f.Name}' must be non-empty and hold no '=' or line break.", nameof(facts));
            }

            if (sb.Length > 0)
            {
                sb.Append('\n');
            }

            sb.Append(f.Name).Append('=');
            foreach (var ch in f.Value ?? string.Empty)
            {
                _ = ch switch
                {
                    '\\' => sb.Append("\\\\"),
                    '\n' => sb.Append("\\n"),
                    '\r' => sb.Append("\\r"),
                    _ => sb.Append(ch),
                };
            }
        }

        return sb.ToString();
    }

    /// <summary>Reads the facts back, in stored order.</summary>
    /// <exception cref="FormatException">When a line has no '=' or a value holds an unknown escape (the message names the line).</exception>
    public static IReadOnlyList<Fact> Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var facts = new List<Fact>();
        if (text.Length == 0)
        {
            return facts;
        }

        var lines = text.Split('\n');
        for (var n = 0; n < lines.Length; n++)
        {
            var line = lines[n];
            var eq = line.IndexOf('=', StringComparison.Ordinal);
            if (eq < 1)
            {
                throw new FormatException(string.Create(CultureInfo.InvariantCulture, $"fact line {n + 1} has no name=value."));
            }

            facts.Add(new Fact(line[..eq], Unescape(line.AsSpan(eq + 1), n + 1)));
        }

        return facts;
    }

    private static string Unescape(ReadOnlySpan<char> value, int line)
    {
        if (value.IndexOf('\\') < 0)
        {
            return value.ToString();
        }

        var sb = new StringBuilder(value.Length);
        for (var i = 0; i < value.Length; i++)
        {
            if (value[i] != '\\')
            {
                sb.Append(value[i]);
                continue;
            }

            if (++i >= value.Length)
            {
                throw new FormatException(string.Create(CultureInfo.InvariantCulture, $"fact line {line} ends in a lone backslash."));
            }

            sb.Append(value[i] switch
            {
                '\\' => '\\',
                'n' => '\n',
                'r' => '\r',
                _ => throw new FormatException(string.Create(CultureInfo.InvariantCulture, $"fact line {line} holds the unknown escape '\\{value[i]}'.")),
            });
        }

        return sb.ToString();
    }
}
