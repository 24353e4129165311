namespace EventReview.Core.Imports;

/// <summary>
/// The project's one CSV reader, RFC 4180 style: comma-separated, optional double quotes ("" escapes a quote, quoted
/// fields may not span lines), a required header row of column names (any order, case-insensitive, each once; extra
/// columns are allowed and ignored by the readers), blank lines and lines starting with '#' skipped, and every data
/// row holding exactly as many fields as the header (an empty field is written as nothing between two commas).
/// </summary>
public static class CsvTable
{
    /// <summary>
    /// Reads every data row after checking that the header holds the required columns.
    /// </summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="requiredColumns">Columns that must be present in the header (case-insensitive).</param>
    /// <exception cref="CsvFormatException">Missing header or column, unbalanced quotes, or more fields than header columns.</exception>
    public static IReadOnlyList<CsvRow> Read(TextReader reader, params string[] requiredColumns) => Read(reader, null, requiredColumns);

    /// <summary>
    /// Reads every data row, naming <paramref name="file"/> in every error (for example the uploaded file's name).
    /// </summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="file">The file's name for messages, or null.</param>
    /// <param name="requiredColumns">Columns that must be present in the header (case-insensitive).</param>
    /// <exception cref="CsvFormatException">Missing header or column, unbalanced quotes, or a row whose field count differs from the header's.</exception>
    public static IReadOnlyList<CsvRow> Read(TextReader reader, string? file, IReadOnlyList<string> requiredColumns)
    {
        ArgumentNullException.ThrowIfNull(reader);
        ArgumentNullException.ThrowIfNull(requiredColumns);
        Dictionary<string, int>? columns = null;
        var rows = new List<CsvRow>();
        var lineNumber = 0;
        while (reader.ReadLine() is { } line)
        {
            lineNumber++;
            if (line.Trim().Length == 0 || line.TrimStart().StartsWith('#'))
            {
                continue;
            }

            var fields = Split(line, lineNumber, file);
            if (columns is null)
            {
                columns = new Dictionary<string, int>(StringComparer.OrdinalIgnoreCase);
                for (var i = 0; i < fields.Count; i++)
                {
                    if (!columns.TryAdd(fields[i].Trim(), i))
                    {
                        throw new CsvFormatException(lineNumber, fields[i].Trim(), "column appears twice in the header", file);
                    }
                }

                foreach (var required in requiredColumns)
                {
                    if (!columns.ContainsKey(required))
                    {
                        throw new CsvFormatException(lineNumber, required,
                            $"header row must contain the columns {string.Join(",", requiredColumns)}", file);
                    }
                }

                continue;
            }

            if (fields.Count != columns.Count)
            {
                throw new CsvFormatException(lineNumber, null, $"{fields.Count} fields but the header has {columns.Count} columns", file);
            }

            rows.Add(new CsvRow(lineNumber, columns, fields, file));
        }

        if (columns is null)
        {
            throw new CsvFormatException(1, null, $"the file is empty: a header row with {string.Join(",", requiredColumns)} is required", file);
        }

        return rows;
    }

    private static List<string> Split(string line, int lineNumber, string? file)
    {
        var fields = new List<string>();
        var current = new System.Text.StringBuilder();
        var inQuotes = false;
        for (var i = 0; i < line.Length; i++)
        {
            var c = line[i];
            if (inQuotes)
            {
                if (c == '"' && i + 1 < line.Length && line[i + 1] == '"')
                {
                    current.Append('"');
                    i++;
                }
                else if (c == '"')
                {
                    inQuotes = false;
                }
                else
                {
                    current.Append(c);
                }
            }
            else if (c == '"')
            {
                inQuotes = true;
            }
            else if (c == ',')
            {
                fields.Add(current.ToString());
                current.Clear();
            }
            else
            {
                current.Append(c);
            }
        }

        if (inQuotes)
        {
            throw new CsvFormatException(lineNumber, null, "unbalanced double quote", file);
        }

        fields.Add(current.ToString());
        return fields;
    }
}
