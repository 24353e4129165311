using System.Globalization;
using EventReview.Core.Time;

namespace EventReview.Core.Significance;

/// <summary>
/// A minimal reader for the plain comma-separated files of this folder: a header row of column names
/// (any order, case-insensitive, extra columns ignored), then one record per line; blank lines and
/// lines starting with '#' are skipped. No quoting (none of these files carries text fields).
/// </summary>
internal sealed class CsvTable
{
    private readonly string _source;
    private readonly Dictionary<string, int> _columns;

    private CsvTable(string source, Dictionary<string, int> columns)
    {
        _source = source;
        _columns = columns;
    }

    /// <summary>Reads rows, calling <paramref name="row"/> with the 1-based line number and the fields.</summary>
    public static void Read(TextReader reader, string source, IReadOnlyList<string> required, Action<CsvTable, int, string[]> row)
    {
        ArgumentNullException.ThrowIfNull(reader);
        var lineNumber = 0;
        CsvTable? table = null;
        while (reader.ReadLine() is { } line)
        {
            lineNumber++;
            var trimmed = line.Trim();
            if (trimmed.Length == 0 || trimmed.StartsWith('#'))
            {
                continue;
            }

            var fields = trimmed.Split(',');
            for (var i = 0; i < fields.Length; i++)
            {
                fields[i] = fields[i].Trim();
            }

            if (table is null)
            {
                var columns = new Dictionary<string, int>(StringComparer.OrdinalIgnoreCase);
                for (var i = 0; i < fields.Length; i++)
                {
                    if (!columns.TryAdd(fields[i], i))
                    {
                        throw new FormatException($"{source} line {lineNumber}: column '{fields[i]}' appears twice in the header.");
                    }
                }

                foreach (var name in required)
                {
                    if (!columns.ContainsKey(name))
                    {
                        throw new FormatException($"{source} line {lineNumber}: the header lacks the column '{name}' (expected {string.Join(",", required)}).");
                    }
                }

                table = new CsvTable(source, columns);
                continue;
            }

            if (fields.Length != table._columns.Count)
            {
                throw new FormatException($"{source} line {lineNumber}: {fields.Length} fields where the header has {table._columns.Count}.");
            }

            row(table, lineNumber, fields);
        }

        if (table is null)
        {
            throw new FormatException($"{source}: the file is empty (a header {string.Join(",", required)} was expected).");
        }
    }

    /// <summary>True when the header has the column.</summary>
    public bool Has(string column) => _columns.ContainsKey(column);

    /// <summary>The raw text of a column in a row, or null when the header lacks it.</summary>
    public string? Text(string[] fields, string column) => _columns.TryGetValue(column, out var i) ? fields[i] : null;

    /// <summary>Parses a GPS time in decimal seconds, exact to the nanosecond.</summary>
    public GpsTime Gps(string[] fields, int line, string column)
    {
        var text = Text(fields, column) ?? string.Empty;
        if (!GpsTime.TryParse(text, out var t))
        {
            throw Error(line, column, $"'{text}' is not a GPS time in decimal seconds");
        }

        return t;
    }

    /// <summary>Parses a finite double (NaN and infinities rejected); null when the field is empty and optional.</summary>
    public double? Number(string[] fields, int line, string column, bool optional)
    {
        var text = Text(fields, column);
        if (string.IsNullOrEmpty(text))
        {
            return optional ? null : throw Error(line, column, "a number is required");
        }

        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var v))
        {
            throw Error(line, column, $"'{text}' is not a number");
        }

        if (!double.IsFinite(v))
        {
            throw Error(line, column, $"'{text}' is not finite");
        }

        return v;
    }

    /// <summary>A format error naming the source, line and column.</summary>
    public FormatException Error(int line, string column, string message) => new($"{_source} line {line}, column '{column}': {message}.");
}
