using EventReview.Core.Imports;

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
    /// <exception cref="CsvFormatException">Naming the file, line and column of the first bad value.</exception>
    public static IReadOnlyList<Trigger> Parse(TextReader reader, string source = "triggers")
    {
        var list = new List<Trigger>();
        foreach (var row in CsvTable.Read(reader, source, Required))
        {
            var time = row.Gps("gps_time");
            var snr = row.Number("snr");
            if (snr < 0)
            {
                throw row.Error("snr", "SNR must not be negative");
            }

            var mc = row.OptionalNumber("chirp_mass");
            if (mc is <= 0)
            {
                throw row.Error("chirp_mass", "chirp mass must be positive");
            }

            var freq = row.OptionalNumber("frequency_hz");
            if (freq is <= 0)
            {
                throw row.Error("frequency_hz", "frequency must be positive");
            }

            list.Add(new Trigger(time, snr, mc, freq));
        }

        return list;
    }

    /// <summary>Reads and parses a trigger file.</summary>
    public static IReadOnlyList<Trigger> Load(string path)
    {
        using var reader = new StreamReader(path);
        return Parse(reader, Path.GetFileName(path));
    }
}
