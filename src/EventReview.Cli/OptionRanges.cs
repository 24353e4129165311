using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;

namespace EventReview.Cli;

/// <summary>
/// The stated range of every number the command line accepts, in one table. <see cref="Apply"/> adds each range to its
/// option's help text and a check that refuses NaN, infinities and values outside it before the verb runs (exit 2,
/// naming the option). The verbs' own checks (and Core's) still apply inside the range. Ids (<c>--case</c>,
/// <c>--id</c>) and the random seed are whole numbers without a range of their own.
/// </summary>
public static class OptionRanges
{
    /// <summary>"verb option" (or "verb sub-verb option") to its inclusive range and unit.</summary>
    public static IReadOnlyDictionary<string, (double Min, double Max, string Unit)> Table { get; } = new Dictionary<string, (double, double, string)>(StringComparer.Ordinal)
    {
        ["timing --k-sigma"] = (0, 10, string.Empty),
        ["timing --false-alarm-probability"] = (0, 1, string.Empty),
        ["timing --observed-sign"] = (-1, 1, string.Empty),
        ["timing --observed-ratio"] = (0, 1e6, string.Empty),
        ["timing --ratio-tolerance"] = (0, 10, string.Empty),
        ["background --window-ms"] = (0, 1000, "ms"),
        ["background --tolerance-ms"] = (0, 1000, "ms"),
        ["background --step-s"] = (0, 1e7, "s"),
        ["background --slides"] = (1, 100_000, string.Empty),
        ["background --candidate-stat"] = (0, 1e6, string.Empty),
        ["background --observing-time-s"] = (0, 3.2e9, "s"),
        ["background --chirp-mass-tolerance"] = (0, 10, string.Empty),
        ["chain --window-s"] = (0, 3600, "s"),
        ["chain --false-alarm-probability"] = (0, 1, string.Empty),
        ["chirp --before-s"] = (0, 3600, "s"),
        ["chirp --after-s"] = (0, 3600, "s"),
        ["environment --window-s"] = (0, 86_400, "s"),
        ["environment --rate-window-s"] = (0, 3.2e9, "s"),
        ["environment --light-travel-s"] = (0, 1, "s"),
        ["environment --candidate-strain"] = (0, 1e-15, "strain"),
        ["environment --sensor-noise"] = (0, 1e12, "sensor units"),
        ["environment --coupling-band-low"] = (0, 65_536, "Hz"),
        ["environment --coupling-band-high"] = (0, 65_536, "Hz"),
        ["environment --coupling-fraction"] = (0, 1, string.Empty),
        ["overlap --window-s"] = (0.01, 10, "s"),
        ["overlap --max-lag-ms"] = (0, 1000, "ms"),
        ["overlap --k-sigma"] = (0, 10, string.Empty),
        ["overlap --overlap-threshold"] = (0, 1, string.Empty),
        ["overlap --psd-segment-s"] = (0.0625, 64, "s"),
        ["overlap --offsource"] = (0, 100_000, string.Empty),
        ["safety --window-s"] = (0, 86_400, "s"),
        ["safety --threshold"] = (0, 1, string.Empty),
        ["safety --live-time-s"] = (0, 3.2e9, "s"),
        ["safety --veto-window-s"] = (0, 86_400, "s"),
        ["simulate --chirp-mass"] = (0, 1000, "solar masses"),
        ["simulate --snr"] = (0, Core.Inputs.InputLimits.MaxSnr, string.Empty),
        ["simulate --duration-s"] = (0, 4096, "s"),
        ["simulate --sample-rate"] = (0, 65_536, "Hz"),
        ["simulate --ra"] = (0, 360, "degrees"),
        ["simulate --dec"] = (-90, 90, "degrees"),
        ["simulate --psi"] = (-360, 360, "degrees"),
        ["simulate --inclination-deg"] = (0, 180, "degrees"),
        ["tokens create --expires-in-days"] = (1, 366, "days"),
        ["unseal --margin-s"] = (0, 86_400, "s"),
    };

    /// <summary>Numeric options that are ids or seeds: any whole number (an unknown id is reported by the verb).</summary>
    public static IReadOnlySet<string> Unbounded { get; } = new HashSet<string>(StringComparer.Ordinal)
    {
        "verify --case", "dossier export --case", "tokens revoke --id", "simulate --seed",
    };

    /// <summary>Adds the ranges of <see cref="Table"/> to <paramref name="command"/> and its sub-commands; returns it.</summary>
    public static Command Apply(Command command) => Apply(command, command.Name);

    private static Command Apply(Command command, string path)
    {
        foreach (var option in command.Options)
        {
            if (Table.TryGetValue($"{path} {option.Name}", out var range))
            {
                var text = option.Description?.TrimEnd() ?? string.Empty;
                var stated = $"range {Show(range.Min)} to {Show(range.Max)}{(range.Unit.Length > 0 ? " " + range.Unit : string.Empty)}.";
                option.Description = text.Length == 0 ? stated : text.EndsWith('.') ? $"{text} R{stated[1..]}" : $"{text}; {stated}";
                option.Validators.Add(result => Check(result, option.Name, range.Min, range.Max));
            }
        }

        foreach (var sub in command.Subcommands)
        {
            Apply(sub, $"{path} {sub.Name}");
        }

        return command;
    }

    private static void Check(OptionResult result, string name, double min, double max)
    {
        foreach (var token in result.Tokens)
        {
            if (!double.TryParse(token.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var value))
            {
                continue; // the parser itself names a value that is not a number
            }

            if (!double.IsFinite(value) || value < min || value > max)
            {
                result.AddError($"{name}: expected a finite number from {Show(min)} to {Show(max)} (got {token.Value}).");
            }
        }
    }

    private static string Show(double x) => x.ToString("G6", CultureInfo.InvariantCulture);
}
