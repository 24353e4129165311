using System.Text;

namespace EventReview.Core.Dossier;

/// <summary>
/// Where an attachment's bytes go inside the dossier ZIP: <c>attachments/&lt;first 16 hex digits of its SHA-256&gt;-&lt;safe name&gt;.&lt;ext&gt;</c>
/// (schema 3), so a reader sees what the file was, and the hash still names it. The safe name keeps only ASCII letters,
/// digits, '-', '_' and '.'; drops any folder part ('/' or '\'); replaces every other character by '_' (runs collapsed);
/// never starts with '.' or '_'; keeps at most <see cref="MaxBaseLength"/> characters of the name and an extension of at
/// most <see cref="MaxExtensionLength"/> letters or digits (lower-cased); an empty name becomes "attachment". Because
/// the hash comes first, no result is a reserved device name (CON, NUL, COM1, ...) or a path outside the folder.
/// </summary>
public static class AttachmentNames
{
    /// <summary>Longest kept name without extension.</summary>
    public const int MaxBaseLength = 60;

    /// <summary>Longest kept extension (without the dot).</summary>
    public const int MaxExtensionLength = 10;

    /// <summary>Hex digits of the SHA-256 in the name.</summary>
    public const int HashDigits = 16;

    /// <summary>The ZIP path of an attachment with <paramref name="sha256"/> (lower-case hex) and original <paramref name="fileName"/>.</summary>
    /// <exception cref="ArgumentException">When <paramref name="sha256"/> is not at least 16 hex digits.</exception>
    public static string PathOf(string sha256, string? fileName)
    {
        ArgumentNullException.ThrowIfNull(sha256);
        if (sha256.Length < HashDigits || !sha256.All(char.IsAsciiHexDigit))
        {
            throw new ArgumentException("An attachment's SHA-256 must be at least 16 hex digits.", nameof(sha256));
        }

        return "attachments/" + sha256[..HashDigits].ToLowerInvariant() + "-" + Safe(fileName);
    }

    /// <summary>The safe form of <paramref name="fileName"/> (rules above), with its extension.</summary>
    public static string Safe(string? fileName)
    {
        var name = (fileName ?? string.Empty).Replace('\\', '/');
        name = name[(name.LastIndexOf('/') + 1)..];
        int dot = name.LastIndexOf('.');
        string ext = dot > 0 ? Clean(name[(dot + 1)..], false) : string.Empty;
        string stem = dot > 0 ? name[..dot] : name;
        if (ext.Length == 0 || ext.Length > MaxExtensionLength || !ext.All(char.IsAsciiLetterOrDigit))
        {
            (stem, ext) = (name, string.Empty);
        }

        stem = Clean(stem, true);
        if (stem.Length > MaxBaseLength)
        {
            stem = stem[..MaxBaseLength].TrimEnd('.', '_', '-');
        }

        if (stem.Length == 0)
        {
            stem = "attachment";
        }

        return ext.Length == 0 ? stem : stem + "." + ext.ToLowerInvariant();
    }

    private static string Clean(string text, bool trimStart)
    {
        var sb = new StringBuilder(text.Length);
        foreach (var ch in text.Normalize(NormalizationForm.FormKC))
        {
            char c = char.IsAsciiLetterOrDigit(ch) || ch is '-' or '_' or '.' ? ch : '_';
            if (c == '_' && sb.Length > 0 && sb[^1] == '_')
            {
                continue;
            }

            sb.Append(c);
        }

        var s = sb.ToString();
        while (s.Contains("..", StringComparison.Ordinal))
        {
            s = s.Replace("..", ".", StringComparison.Ordinal);
        }

        return trimStart ? s.TrimStart('.', '_').TrimEnd('.', '_') : s;
    }
}
