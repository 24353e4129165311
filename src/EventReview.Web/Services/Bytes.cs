using System.Globalization;

namespace EventReview.Web.Services;

/// <summary>File sizes for people: bytes, KB or MB (1 KB = 1024 bytes), one decimal.</summary>
public static class Bytes
{
    public static string Format(long bytes) => bytes switch
    {
        < 1024 => string.Create(CultureInfo.InvariantCulture, $"{bytes} B"),
        < 1024 * 1024 => string.Create(CultureInfo.InvariantCulture, $"{bytes / 1024.0:F1} KB"),
        _ => string.Create(CultureInfo.InvariantCulture, $"{bytes / (1024.0 * 1024):F1} MB"),
    };
}
