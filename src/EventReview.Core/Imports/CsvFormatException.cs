namespace EventReview.Core.Imports;

/// <summary>
/// A CSV import failed. <see cref="LineNumber"/> is 1-based and counts the header as line 1;
/// <see cref="Column"/> names the offending column when one is to blame (null for whole-line problems).
/// </summary>
public sealed class CsvFormatException : FormatException
{
    /// <summary>
    /// Creates the exception; the message is prefixed with "line N" (and "column X" when given), and with the file's
    /// name <paramref name="file"/> when one is given ("triggers.csv line 3, column 'snr': ...").
    /// </summary>
    public CsvFormatException(int lineNumber, string? column, string problem, string? file = null)
        : base((string.IsNullOrEmpty(file) ? string.Empty : file + " ") + (column is null ? $"line {lineNumber}: {problem}" : $"line {lineNumber}, column '{column}': {problem}"))
    {
        LineNumber = lineNumber;
        Column = column;
        File = string.IsNullOrEmpty(file) ? null : file;
    }

    /// <summary>The file's name as given to the reader, or null.</summary>
    public string? File { get; }

    /// <summary>1-based line number in the file (the header is line 1).</summary>
    public int LineNumber { get; }

    /// <summary>Column name at fault, or null when the whole line is at fault.</summary>
    public string? Column { get; }
}
