using System.Globalization;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Io;
using EventReview.Core.Time;

namespace EventReview.Cli.Commands;

/// <summary>Shared parsing helpers for the strain verbs.</summary>
internal static class StrainInput
{
    /// <summary>Reads a strain text file; errors become a message naming the file and line.</summary>
    public static TimeSeries Read(string path, string label)
    {
        if (!File.Exists(path))
        {
            throw new StrainFormatException(0, $"{label} file '{path}' does not exist.");
        }

        try
        {
            return StrainTextReader.ReadFile(path);
        }
        catch (StrainFormatException ex)
        {
            throw new StrainFormatException(ex.LineNumber, $"{label} file '{path}': {ex.Message}");
        }
    }

    public static GpsTime Center(string text) =>
        GpsTime.TryParse(text, out var t) ? t : throw new FormatException($"--center '{text}' is not a GPS time in decimal seconds.");

    public static (double Low, double High) Band(string text)
    {
        var parts = text.Split(',', StringSplitOptions.TrimEntries);
        if (parts.Length != 2
            || !double.TryParse(parts[0], NumberStyles.Float, CultureInfo.InvariantCulture, out var lo)
            || !double.TryParse(parts[1], NumberStyles.Float, CultureInfo.InvariantCulture, out var hi)
            || !(lo > 0) || !(hi > lo))
        {
            throw new FormatException($"--band '{text}' must be two frequencies in Hz, low,high with 0 < low < high.");
        }

        return (lo, hi);
    }
}
