namespace EventReview.Core.Evidence;

/// <summary>
/// Cleans a user-supplied file name for display and for download headers. The result is never used as a path: stored
/// files are named by their SHA-256.
/// </summary>
public static class SafeFileName
{
    /// <summary>Longest name kept, in characters.</summary>
    public const int MaxLength = 200;

    /// <summary>
    /// The last path segment (both '/' and '\' count as separators), without control or bidirectional-override
    /// characters, trimmed of spaces and dots, cut to <see cref="MaxLength"/> characters (keeping the extension when
    /// short); <paramref name="fallback"/> when nothing is left (also for null, "." and "..").
    /// </summary>
    public static string From(string? name, string fallback = "attachment")
    {
        var text = (name ?? string.Empty).Replace('\\', '/');
        var slash = text.LastIndexOf('/');
        if (slash >= 0)
        {
            text = text[(slash + 1)..];
        }

        text = new string(text.Where(c => !char.IsControl(c) && !IsFormatting(c)).ToArray()).Trim().Trim('.').Trim();
        if (text.Length == 0)
        {
            return fallback;
        }

        if (text.Length > MaxLength)
        {
            var dot = text.LastIndexOf('.');
            var ext = dot > 0 && text.Length - dot <= 16 ? text[dot..] : string.Empty;
            text = text[..(MaxLength - ext.Length)] + ext;
        }

        return text;
    }

    // Right-to-left overrides and similar invisible marks can disguise "evil.exe" as "exe.live" in a listing.
    private static bool IsFormatting(char c) => char.GetUnicodeCategory(c) == System.Globalization.UnicodeCategory.Format;
}
