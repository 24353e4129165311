namespace EventReview.Core.Imports;

/// <summary>
/// A minimal RFC 4180 style CSV reader: comma-separated, optional double quotes ("" escapes a quote, quoted
/// fields may not span lines), a required header row, blank lines and lines starting with '#' skipped.
/// </summary>
public static class CsvTable
{
    /// <summary>
    /// Reads every data row after checking that the header holds the required columns.
    /// </summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="requiredColumns">Columns that must be present in the header (case-insensitive).</param>
    /// <exception cref="CsvFormatException">Missing header or column, unbalanced quotes, or more fields than header columns.</exception>
    public static IReadOnlyList<CsvRow> Read(TextReader reader, params string[] requiredColumns)
    {
        ArgumentNullException.ThrowIfNull(reader);
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

            var fields = Split(line, lineNumber);
            if (columns is null)
            {
                columns = new Dictionary<string, int>(StringComparer.OrdinalIgnoreCase);
                for (var i = 0; i < fields.Count; i++)
                {
                    if (!columns.TryAdd(fields[i].Trim(), i))
                    {
                        throw new CsvFormatException(lineNumber, fields[i].Trim(), "column appears twice in the header");
                    }
                }

                foreach (var required in requiredColumns)
                {
                    if (!columns.ContainsKey(required))
                    {
                        throw new CsvFormatException(lineNumber, required,
                            $"header row must contain the columns {string.Join(",", requiredColumns)}");
                    }
                }

                continue;
            }

            if (fields.Count > columns.Count)
            {
                throw new CsvFormatException(lineNumber, null, $"{fields.Count} fields but the header has {columns.Count} columns");
            }

            rows.Add(new CsvRow(lineNumber, columns, fields));
        }

        if (columns is null)
        {
            throw new CsvFormatException(1, null, "the file is empty: a header row is required");
        }

        return rows;
    }

    private static List<string> Split(string line, int lineNumber)
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
            throw new CsvFormatException(lineNumber, null, "unbalanced double quote");
        }

        fields.Add(current.ToString());
        return fields;
    }
}
