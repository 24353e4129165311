using System.IO.Compression;
using System.Text;
using System.Text.RegularExpressions;

namespace EventReview.Dossier;

/// <summary>
/// The text a PDF written by <see cref="DossierPdf"/> shows: every string operand in its (Flate-compressed or plain)
/// streams, in file order; literal strings decoded byte for byte (PDFsharp writes WinAnsi here), hexadecimal strings
/// kept as their digits. Enough to compare two renderings of the same document; not a general PDF reader. Never throws
/// for bad input: an unreadable stream gives no text.
/// </summary>
public static partial class PdfText
{
    /// <summary>The strings shown, in order.</summary>
    public static IReadOnlyList<string> Extract(byte[] pdf)
    {
        ArgumentNullException.ThrowIfNull(pdf);
        var text = Encoding.Latin1.GetString(pdf);
        var shown = new List<string>();
        foreach (Match m in StreamStart().Matches(text))
        {
            var dictionary = m.Groups[1].Value;
            if (dictionary.Contains("/Length1", StringComparison.Ordinal) || dictionary.Contains("/Subtype/XML", StringComparison.Ordinal)
                || LengthOf(dictionary) is not { } length || m.Index + m.Length + length > pdf.Length)
            {
                continue;
            }

            var body = pdf.AsSpan(m.Index + m.Length, length).ToArray();
            if (dictionary.Contains("/FlateDecode", StringComparison.Ordinal) && Inflate(body) is { } inflated)
            {
                body = inflated;
            }

            Strings(body, shown);
        }

        return shown;
    }

    private static int? LengthOf(string dictionary)
    {
        var m = Length().Match(dictionary);
        return m.Success && int.TryParse(m.Groups[1].Value, out var n) && n >= 0 ? n : null;
    }

    private static byte[]? Inflate(byte[] body)
    {
        try
        {
            using var z = new ZLibStream(new MemoryStream(body), CompressionMode.Decompress);
            using var ms = new MemoryStream();
            z.CopyTo(ms);
            return ms.ToArray();
        }
        catch (InvalidDataException)
        {
            return null;
        }
    }

    private static void Strings(byte[] s, List<string> shown)
    {
        for (var i = 0; i < s.Length; i++)
        {
            if (s[i] == '%')
            {
                while (i < s.Length && s[i] != '\n' && s[i] != '\r')
                {
                    i++;
                }
            }
            else if (s[i] == '(')
            {
                shown.Add(Literal(s, ref i));
            }
            else if (s[i] == '<' && i + 1 < s.Length && s[i + 1] != '<')
            {
                var end = Array.IndexOf(s, (byte)'>', i);
                if (end < 0)
                {
                    return;
                }

                shown.Add("<" + Encoding.Latin1.GetString(s, i + 1, end - i - 1).Trim() + ">");
                i = end;
            }
            else if (s[i] == '<')
            {
                i++; // a dictionary opener '<<'
            }
        }
    }

    /// <summary>Reads a literal string starting at s[i] == '(' (balanced parentheses, backslash escapes); leaves i on its closing ')'.</summary>
    private static string Literal(byte[] s, ref int i)
    {
        var sb = new StringBuilder();
        var depth = 0;
        for (; i < s.Length; i++)
        {
            var c = (char)s[i];
            if (c == '(' && depth++ == 0)
            {
                continue;
            }

            if (c == ')' && --depth == 0)
            {
                return sb.ToString();
            }

            if (c != '\\' || i + 1 >= s.Length)
            {
                sb.Append(c);
                continue;
            }

            var e = (char)s[++i];
            if (e is >= '0' and <= '7')
            {
                var value = 0;
                for (var k = 0; k < 3 && i < s.Length && s[i] is >= (byte)'0' and <= (byte)'7'; k++, i++)
                {
                    value = (value * 8) + (s[i] - '0');
                }

                i--;
                sb.Append((char)(value & 0xFF));
                continue;
            }

            sb.Append(e switch { 'n' => '\n', 'r' => '\r', 't' => '\t', 'b' => '\b', 'f' => '\f', '\r' or '\n' => '\0', _ => e });
            if (sb[^1] == '\0')
            {
                sb.Length--;
            }
        }

        return sb.ToString();
    }

    [GeneratedRegex(@"<<((?:(?!>>).){0,400}?)>>\s*stream\r?\n", RegexOptions.Singleline)]
    private static partial Regex StreamStart();

    [GeneratedRegex(@"/Length\s+(\d+)(?!\s+\d+\s+R)")]
    private static partial Regex Length();
}
