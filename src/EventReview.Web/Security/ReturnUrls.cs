namespace EventReview.Web.Security;

/// <summary>
/// Where the sign-in form may send a user afterwards: only a path of this app. Checked before the password is, so a
/// hostile value can neither redirect elsewhere nor fail after a sign-in has been recorded.
/// </summary>
public static class ReturnUrls
{
    /// <summary>Where a user goes when the form gave no usable return address.</summary>
    public const string Default = "/cases";

    /// <summary>Longest return address kept, characters.</summary>
    public const int MaxLength = 2048;

    /// <summary>
    /// <paramref name="url"/> when it is a local path: it starts with a single '/', holds no backslash, no control,
    /// white-space or invisible character (browsers drop tabs and newlines, so <c>/\t/evil.example</c> would become
    /// <c>//evil.example</c>, another host), and is at most <see cref="MaxLength"/> characters; otherwise <see cref="Default"/>.
    /// </summary>
    public static string Safe(string? url)
    {
        if (string.IsNullOrEmpty(url) || url.Length > MaxLength || url[0] != '/' || (url.Length > 1 && url[1] is '/' or '\\'))
        {
            return Default;
        }

        foreach (var c in url)
        {
            if (c == '\\' || char.IsWhiteSpace(c) || char.IsControl(c) || char.GetUnicodeCategory(c) == System.Globalization.UnicodeCategory.Format || char.IsSurrogate(c))
            {
                return Default;
            }
        }

        return Uri.TryCreate(url, UriKind.Relative, out _) ? url : Default;
    }
}
