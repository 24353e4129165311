namespace EventReview.Core.Imports;

/// <summary>
/// A CSV import failed. <see cref="LineNumber"/> is 1-based and counts the header as line 1;
/// <see cref="Column"/> names the offending column when one is to blame (null for whole-line problems).
/// </summary>
public sealed class CsvFormatException : FormatException
{
    /// <summary>Creates the exception; the message is prefixed with "line N" (and "column X" when given).</summary>
    public CsvFormatException(int lineNumber, string? column, string problem)
        : base(column is null ? $"line {lineNumber}: {problem}" : $"line {lineNumber}, column '{column}': {problem}")
    {
        LineNumber = lineNumber;
        Column = column;
    }

    /// <summary>1-based line number in the file (the header is line 1).</summary>
    public int LineNumber { get; }

    /// <summary>Column name at fault, or null when the whole line is at fault.</summary>
    public string? Column { get; }
}
