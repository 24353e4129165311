using System.CommandLine;
using EventReview.Core.Configuration;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview config diff --frozen A --snapshot B [--freeze-from T --freeze-until T --captured-at T] [--json]</c>: compares two
/// configuration files (<c>key = value</c> lines or JSON, see <see cref="ConfigurationImport"/>) with the app's drift rule
/// (<see cref="DriftCheck"/>). Prints added (+), removed (-) and changed (~) keys and the verdict, or with <c>--json</c>
/// <c>{"added": [{key, value}], "removed": [{key, value}], "changed": [{key, old, new}], "unchanged": n, "hasDrift": b, "verdict", "reason"}</c>.
/// The verdict is "no drift", "drift", or "concern" when the freeze period is given and the snapshot was captured inside it.
/// Exit 0 when the files hold the same items, 1 when they differ (like diff), 2 on a bad file or time.
/// </summary>
public static class ConfigCommand
{
    public static Command Build()
    {
        var command = new Command("config", "Configuration snapshots: compare a later snapshot with the frozen one.");
        command.Subcommands.Add(Diff());
        return command;
    }

    private static Command Diff()
    {
        var frozen = new Option<string>("--frozen") { Description = "The frozen configuration (key = value lines or JSON).", Required = true };
        var snapshot = new Option<string>("--snapshot") { Description = "The later snapshot to compare with it.", Required = true };
        var from = new Option<string?>("--freeze-from") { Description = "Start of the freeze period, ISO 8601 UTC (with --freeze-until and --captured-at)." };
        var until = new Option<string?>("--freeze-until") { Description = "End of the freeze period, ISO 8601 UTC." };
        var captured = new Option<string?>("--captured-at") { Description = "When the later snapshot was captured, ISO 8601 UTC." };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON." };
        var command = new Command("diff", "Show added, removed and changed keys between two configuration files, and the drift verdict.");
        foreach (var o in new Option[] { frozen, snapshot, from, until, captured, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse =>
        {
            IReadOnlyDictionary<string, string> a, b;
            DriftReport report;
            try
            {
                a = Read(parse.GetValue(frozen)!, "--frozen");
                b = Read(parse.GetValue(snapshot)!, "--snapshot");
                var times = new[] { (parse.GetValue(from), "--freeze-from"), (parse.GetValue(until), "--freeze-until"), (parse.GetValue(captured), "--captured-at") };
                if (times.All(t => t.Item1 is null))
                {
                    report = DriftCheck.Compare(Path.GetFileName(parse.GetValue(snapshot)!), a, b);
                }
                else if (times.Any(t => t.Item1 is null))
                {
                    return CliOutput.Fail("give all three of --freeze-from, --freeze-until and --captured-at, or none.");
                }
                else
                {
                    var (f, u, c) = (Time(times[0]), Time(times[1]), Time(times[2]));
                    report = DriftCheck.Run(Path.GetFileName(parse.GetValue(snapshot)!), a, f, u, b, c);
                }
            }
            catch (Exception ex) when (ex is FormatException or IOException or UnauthorizedAccessException)
            {
                return CliOutput.Fail(ex.Message);
            }

            var diff = report.Diff;
            if (parse.GetValue(json))
            {
                CliOutput.WriteJson(new { added = diff.Added, removed = diff.Removed, changed = diff.Changed, unchanged = diff.Unchanged, hasDrift = diff.HasDrift, verdict = report.Verdict, reason = report.Summary });
            }
            else
            {
                foreach (var x in diff.Added)
                {
                    Console.Out.WriteLine($"+ {x.Key} = {Line(x.Value)}");
                }

                foreach (var x in diff.Removed)
                {
                    Console.Out.WriteLine($"- {x.Key} = {Line(x.Value)}");
                }

                foreach (var x in diff.Changed)
                {
                    Console.Out.WriteLine($"~ {x.Key}: {Line(x.Old)} -> {Line(x.New)}");
                }

                Console.Out.WriteLine($"{diff.Added.Count} added, {diff.Removed.Count} removed, {diff.Changed.Count} changed, {diff.Unchanged} unchanged");
                Console.Out.WriteLine($"verdict: {report.Verdict} ({report.Summary})");
            }

            return diff.HasDrift ? CliOutput.Negative : CliOutput.Success;
        });
        return command;
    }

    private static IReadOnlyDictionary<string, string> Read(string path, string option)
    {
        if (!File.Exists(path))
        {
            throw new FileNotFoundException($"{option}: file '{path}' not found");
        }

        var info = new FileInfo(path);
        if (info.Length > 256L * 1024 * 1024)
        {
            throw new FormatException($"{option} {path}: the file is larger than 256 MB.");
        }

        return ConfigurationImport.Parse(File.ReadAllText(path), path);
    }

    private static DateTimeOffset Time((string? Text, string Option) t) =>
        DateTimeOffset.TryParse(t.Text, System.Globalization.CultureInfo.InvariantCulture, System.Globalization.DateTimeStyles.AssumeUniversal | System.Globalization.DateTimeStyles.AdjustToUniversal, out var v)
            ? v
            : throw new FormatException($"{t.Option} '{t.Text}': expected an ISO 8601 UTC time such as 2026-12-01T00:00:00Z.");

    private static string Line(string value) => value.ReplaceLineEndings("\\n");
}
