using EventReview.Core.Inputs;
using EventReview.Core.Network;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Io;
using EventReview.Core.Time;

namespace EventReview.Cli;

/// <summary>Argument parsing shared by the local-cause verbs (environment, safety, seal, unseal, chain).</summary>
internal static class LocalCausesInput
{
    /// <summary>Parses a GPS time option or throws a <see cref="FormatException"/> naming it.</summary>
    public static GpsTime Gps(string text, string option) =>
        GpsTime.TryParse(text, out var t) ? t : throw new FormatException($"{option}: '{text}' is not a GPS time in decimal seconds");

    /// <summary>Parses repeated CODE=GPS values into a dictionary keyed by upper-case site code.</summary>
    public static Dictionary<string, GpsTime> Arrivals(IEnumerable<string>? values)
    {
        var map = new Dictionary<string, GpsTime>(StringComparer.OrdinalIgnoreCase);
        foreach (var v in values ?? [])
        {
            var parts = v.Split('=', 2);
            if (parts.Length != 2 || parts[0].Trim().Length == 0)
            {
                throw new FormatException($"--arrival: '{v}' must be CODE=GPS");
            }

            if (!map.TryAdd(parts[0].Trim().ToUpperInvariant(), Gps(parts[1], "--arrival " + parts[0].Trim())))
            {
                throw new FormatException($"--arrival: site {parts[0].Trim()} given twice");
            }
        }

        return map;
    }

    /// <summary>Opens a text file, naming it in the error when it is missing.</summary>
    public static StreamReader Open(string path, string option) =>
        File.Exists(path) ? new StreamReader(path) : throw new FileNotFoundException($"{option}: file '{path}' not found");

    /// <summary>Reads a CSV file with a parser, prefixing any format error with the option and file name.</summary>
    public static T Read<T>(string path, string option, Func<TextReader, T> parse)
    {
        using var reader = Open(path, option);
        try
        {
            return parse(reader);
        }
        catch (FormatException ex)
        {
            throw new FormatException($"{option} {path}: {ex.Message}");
        }
    }

    /// <summary>Reads a text series ("gps_time value" per line), naming the option and file in any error.</summary>
    public static TimeSeries Series(string path, string option)
    {
        if (!File.Exists(path))
        {
            throw new FileNotFoundException($"{option}: file '{path}' not found");
        }

        try
        {
            return StrainTextReader.ReadFile(path);
        }
        catch (StrainFormatException ex)
        {
            throw new FormatException($"{option} {path}: {ex.Message}");
        }
    }

    /// <summary>Reads a network file, naming the option in the error.</summary>
    public static NetworkDefinition Network(string path, string option)
    {
        if (!File.Exists(path))
        {
            throw new FileNotFoundException($"{option}: file '{path}' not found");
        }

        try
        {
            return NetworkFile.Read(path);
        }
        catch (FormatException ex)
        {
            throw new FormatException($"{option} {path}: {ex.Message}");
        }
    }

    /// <summary>The leap-second state behind the UTC of <paramref name="gps"/>, now from the system clock.</summary>
    public static LeapSecondNotice Leap(GpsTime gps) => LeapSecondNotice.For(gps, TimeProvider.System.GetUtcNow().UtcDateTime);

    /// <summary>Writes the leap-second warning, if any, to standard error (text output).</summary>
    public static void WarnLeap(LeapSecondNotice notice)
    {
        if (notice.Warning is { } w)
        {
            Console.Error.WriteLine("warning: " + w);
        }
    }

    /// <summary>Parses repeated CODE=FILE values (site code upper-cased), refusing a site named twice.</summary>
    public static List<(string Code, string File)> CodeFiles(IEnumerable<string>? values, string option)
    {
        var list = new List<(string, string)>();
        foreach (var v in values ?? [])
        {
            var eq = v.IndexOf('=', StringComparison.Ordinal);
            if (eq <= 0 || eq == v.Length - 1)
            {
                throw new ArgumentException($"{option} expects CODE=FILE, got '{v}'.");
            }

            var code = v[..eq].Trim().ToUpperInvariant();
            if (list.Any(p => p.Item1 == code))
            {
                throw new ArgumentException($"{option} names site {code} twice.");
            }

            list.Add((code, v[(eq + 1)..]));
        }

        return list;
    }

    /// <summary>Runs a verb body, turning bad input into exit code 2 with a one-line message.</summary>
    public static int Guard(Func<int> body)
    {
        try
        {
            return body();
        }
        catch (Exception ex) when (ex is FormatException or ArgumentException or IOException or UnauthorizedAccessException)
        {
            return CliOutput.Fail(UserMessage.From(ex));
        }
    }
}
