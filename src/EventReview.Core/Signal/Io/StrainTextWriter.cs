using System.Globalization;

namespace EventReview.Core.Signal.Io;

/// <summary>Writes a time series in the text format read by <see cref="StrainTextReader"/>.</summary>
public static class StrainTextWriter
{
    /// <summary>
    /// Writes '#' comment lines (one per entry of <paramref name="comments"/>), a header line "gps_time value", then one
    /// "gps_time value" line per sample, separated by a space. Times are exact to the nanosecond; values use the
    /// shortest round-trip form, invariant culture.
    /// </summary>
    public static void Write(TextWriter writer, TimeSeries series, IEnumerable<string>? comments = null)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(series);
        foreach (var c in comments ?? [])
        {
            writer.Write("# ");
            writer.WriteLine(c.ReplaceLineEndings(" "));
        }

        writer.WriteLine("gps_time value");
        var samples = series.Samples;
        for (int i = 0; i < samples.Length; i++)
        {
            writer.Write(series.TimeOf(i).ToString());
            writer.Write(' ');
            writer.WriteLine(samples[i].ToString("R", CultureInfo.InvariantCulture));
        }
    }

    /// <summary>Writes the series to a file (UTF-8), overwriting it.</summary>
    public static void WriteFile(string path, TimeSeries series, IEnumerable<string>? comments = null)
    {
        using var writer = new StreamWriter(path);
        Write(writer, series, comments);
    }
}
