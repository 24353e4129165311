using System.CommandLine;
using EventReview.Core.Configuration;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview config diff --frozen A --snapshot B [--json]</c>: compares two configuration files (<c>key = value</c>
/// lines or JSON, see <see cref="ConfigurationImport"/>). Prints added (+), removed (-) and changed (~) keys, or with
/// <c>--json</c> <c>{"added": [{key, value}], "removed": [{key, value}], "changed": [{key, old, new}], "unchanged": n, "hasDrift": b}</c>.
/// Exit 0 when the files hold the same items, 1 when they differ (like diff), 2 on a bad file.
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
        var json = new Option<bool>("--json") { Description = "Write the result as JSON." };
        var command = new Command("diff", "Show added, removed and changed keys between two configuration files.");
        command.Options.Add(frozen);
        command.Options.Add(snapshot);
        command.Options.Add(json);
        command.SetAction(parse =>
        {
            IReadOnlyDictionary<string, string> a, b;
            try
            {
                a = Read(parse.GetValue(frozen)!, "--frozen");
                b = Read(parse.GetValue(snapshot)!, "--snapshot");
            }
            catch (Exception ex) when (ex is FormatException or IOException or UnauthorizedAccessException)
            {
                return CliOutput.Fail(ex.Message);
            }

            var diff = ConfigurationDiff.Compare(a, b);
            if (parse.GetValue(json))
            {
                CliOutput.WriteJson(new { added = diff.Added, removed = diff.Removed, changed = diff.Changed, unchanged = diff.Unchanged, hasDrift = diff.HasDrift });
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

    private static string Line(string value) => value.ReplaceLineEndings("\\n");
}
