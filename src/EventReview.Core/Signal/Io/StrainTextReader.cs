using System.Globalization;
using EventReview.Core.Time;

namespace EventReview.Core.Signal.Io;

/// <summary>
/// Reads strain from plain text: one sample per line, "gps_time value" separated by spaces, tabs or a comma;
/// lines starting with '#' and blank lines are ignored; one header line (a first non-comment line that is not two numbers)
/// is allowed. The sample rate is taken from the whole span, (n − 1) / (t_last − t_first), every step must be within
/// the tolerance of the mean step, times strictly increasing, values finite.
/// </summary>
public static class StrainTextReader
{
    private static readonly char[] Separators = [' ', '\t', ','];

    /// <summary>Reads a file. See <see cref="Read(TextReader, StrainReadOptions?)"/>.</summary>
    /// <exception cref="StrainFormatException">When the content is malformed (message names the line).</exception>
    public static TimeSeries ReadFile(string path, StrainReadOptions? options = null)
    {
        using var reader = new StreamReader(path);
        return Read(reader, options);
    }

    /// <summary>Reads a strain series from text.</summary>
    /// <exception cref="StrainFormatException">When a line is malformed, times are not increasing or not uniform,
    /// a value is NaN or infinite, or there are too few samples; the message names the first bad line.</exception>
    public static TimeSeries Read(TextReader reader, StrainReadOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(reader);
        options ??= new StrainReadOptions();
        var times = new List<decimal>();
        var lines = new List<int>();
        var values = new List<double>();
        int lineNo = 0;
        bool headerAllowed = true;
        string? line;
        while ((line = reader.ReadLine()) is not null)
        {
            lineNo++;
            var text = line.Trim();
            if (text.Length == 0 || text[0] == '#')
            {
                continue;
            }

            var parts = text.Split(Separators, StringSplitOptions.RemoveEmptyEntries);
            bool okTime = parts.Length >= 1 && decimal.TryParse(parts[0], NumberStyles.Float, CultureInfo.InvariantCulture, out var t);
            if (headerAllowed && !okTime)
            {
                headerAllowed = false;
                continue;
            }

            headerAllowed = false;
            if (parts.Length != 2)
            {
                throw new StrainFormatException(lineNo, $"expected two columns 'gps_time value', found {parts.Length}: \"{Clip(text)}\".");
            }

            if (!decimal.TryParse(parts[0], NumberStyles.Float, CultureInfo.InvariantCulture, out t))
            {
                throw new StrainFormatException(lineNo, $"GPS time \"{Clip(parts[0])}\" is not a number.");
            }

            if (!double.TryParse(parts[1], NumberStyles.Float, CultureInfo.InvariantCulture, out var v))
            {
                throw new StrainFormatException(lineNo, $"value \"{Clip(parts[1])}\" is not a number.");
            }

            if (!double.IsFinite(v))
            {
                throw new StrainFormatException(lineNo, "value is NaN or infinite.");
            }

            if (times.Count > 0 && t <= times[^1])
            {
                throw new StrainFormatException(lineNo, $"GPS time {t} is not after the previous sample's {times[^1]}.");
            }

            times.Add(t);
            values.Add(v);
            lines.Add(lineNo);
        }

        if (times.Count < Math.Max(2, options.MinimumSamples))
        {
            throw new StrainFormatException(0, $"the file holds {times.Count} samples; at least {Math.Max(2, options.MinimumSamples)} are needed.");
        }

        decimal span = times[^1] - times[0];
        decimal meanStep = span / (times.Count - 1);
        double rate = (double)((times.Count - 1) / span);
        decimal tol = meanStep * (decimal)options.StepTolerance;
        for (int i = 1; i < times.Count; i++)
        {
            decimal step = times[i] - times[i - 1];
            if (Math.Abs(step - meanStep) > tol)
            {
                throw new StrainFormatException(lines[i], $"time step {step} s differs from the file's mean step {meanStep:G8} s by more than {options.StepTolerance:P1} (samples must be uniformly spaced).");
            }
        }

        if (options.SnapSampleRate && Math.Abs(rate - Math.Round(rate)) <= 1e-5 * rate)
        {
            rate = Math.Round(rate);
        }

        return new TimeSeries(GpsTime.FromSeconds(times[0]), rate, values.ToArray());
    }

    private static string Clip(string s) => s.Length <= 40 ? s : s[..40] + "…";
}
