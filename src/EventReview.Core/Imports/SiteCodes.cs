namespace EventReview.Core.Imports;

/// <summary>Checks site codes read from import files against the network's known codes.</summary>
public static class SiteCodes
{
    /// <summary>
    /// Returns the upper-cased site code of a row's <c>site</c> column, or throws naming the line when the code is not
    /// among <paramref name="knownSites"/>. A null <paramref name="knownSites"/> accepts any well-formed code (1-8 letters or digits).
    /// </summary>
    public static string Read(CsvRow row, IReadOnlyCollection<string>? knownSites, string column = "site")
    {
        ArgumentNullException.ThrowIfNull(row);
        var code = row.Text(column).ToUpperInvariant();
        if (code.Length is < 1 or > 8 || !code.All(char.IsAsciiLetterOrDigit))
        {
            throw row.Error(column, $"'{code}' is not a site code (1-8 letters or digits)");
        }

        if (knownSites is not null && !knownSites.Contains(code, StringComparer.OrdinalIgnoreCase))
        {
            throw row.Error(column, $"unknown site '{code}' (known: {string.Join(", ", knownSites)})");
        }

        return code;
    }
}
