using System.Globalization;
using EventReview.Core.Time;

namespace EventReview.Core.Imports;

/// <summary>
/// One data row of a CSV file with typed accessors that throw <see cref="CsvFormatException"/> naming the
/// line and column on bad values. Column lookup is by header name, case-insensitive.
/// </summary>
public sealed class CsvRow
{
    private readonly IReadOnlyDictionary<string, int> _columns;
    private readonly IReadOnlyList<string> _fields;
    private readonly string? _file;

    internal CsvRow(int lineNumber, IReadOnlyDictionary<string, int> columns, IReadOnlyList<string> fields, string? file = null)
    {
        LineNumber = lineNumber;
        _columns = columns;
        _fields = fields;
        _file = file;
    }

    /// <summary>1-based line number in the file (header = line 1).</summary>
    public int LineNumber { get; }

    /// <summary>Trimmed text of a column, or null when the column is absent from the header or the cell is empty.</summary>
    public string? Optional(string column) =>
        _columns.TryGetValue(column, out var i) && i < _fields.Count && _fields[i].Trim().Length > 0 ? _fields[i].Trim() : null;

    /// <summary>Trimmed, non-empty text of a required column.</summary>
    public string Text(string column) => Optional(column) ?? throw Error(column, "value is missing");

    /// <summary>A required finite number (invariant culture); NaN and infinities are rejected.</summary>
    public double Number(string column) => ParseNumber(column, Text(column));

    /// <summary>An optional finite number; null when the cell is empty.</summary>
    public double? OptionalNumber(string column) => Optional(column) is { } t ? ParseNumber(column, t) : null;

    /// <summary>A required GPS time in decimal seconds, kept to the nanosecond.</summary>
    public GpsTime Gps(string column)
    {
        var text = Text(column);
        return GpsTime.TryParse(text, out var t) ? t : throw Error(column, $"'{text}' is not a GPS time in decimal seconds");
    }

    /// <summary>Builds an exception naming this row's line and the given column (null for the whole line).</summary>
    public CsvFormatException Error(string? column, string problem) => new(LineNumber, column, problem, _file);

    private double ParseNumber(string column, string text)
    {
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var v) || !double.IsFinite(v))
        {
            throw Error(column, $"'{text}' is not a finite number");
        }

        return v;
    }
}
