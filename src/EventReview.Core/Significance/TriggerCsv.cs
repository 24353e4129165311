namespace EventReview.Core.Significance;

/// <summary>
/// Reads a single-site trigger list: a CSV with the header columns <c>gps_time,snr</c> and optionally
/// <c>chirp_mass,frequency_hz</c>, in any order (extra columns are ignored). GPS times are decimal
/// seconds kept to the nanosecond; SNR must be finite and &gt;= 0; chirp mass (solar masses) and
/// frequency (Hz) must be finite and &gt; 0 when present, and may be left empty on a row.
/// </summary>
public static class TriggerCsv
{
    private static readonly string[] Required = ["gps_time", "snr"];

    /// <summary>Parses trigger rows in file order.</summary>
    /// <param name="reader">The CSV text.</param>
    /// <param name="source">A name for error messages (e.g. the file name).</param>
    /// <exception cref="FormatException">Naming the line and column of the first bad value.</exception>
    public static IReadOnlyList<Trigger> Parse(TextReader reader, string source = "triggers")
    {
        var list = new List<Trigger>();
        CsvTable.Read(reader, source, Required, (t, line, f) =>
        {
            var time = t.Gps(f, line, "gps_time");
            var snr = t.Number(f, line, "snr", optional: false)!.Value;
            if (snr < 0)
            {
                throw t.Error(line, "snr", "SNR must not be negative");
            }

            var mc = t.Number(f, line, "chirp_mass", optional: true);
            if (mc is <= 0)
            {
                throw t.Error(line, "chirp_mass", "chirp mass must be positive");
            }

            var freq = t.Number(f, line, "frequency_hz", optional: true);
            if (freq is <= 0)
            {
                throw t.Error(line, "frequency_hz", "frequency must be positive");
            }

            list.Add(new Trigger(time, snr, mc, freq));
        });
        return list;
    }

    /// <summary>Reads and parses a trigger file.</summary>
    public static IReadOnlyList<Trigger> Load(string path)
    {
        using var reader = new StreamReader(path);
        return Parse(reader, Path.GetFileName(path));
    }
}
