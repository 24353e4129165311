using System.CommandLine;
using System.Globalization;
using EventReview.Core.Injections;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview unseal</c>: verifies a sealed record; optionally reports blind injections overlapping a case.</summary>
public static class UnsealCommand
{
    public static Command Build()
    {
        var commitment = new Option<string>("--commitment") { Description = "Commitment printed by seal (hex).", Required = true };
        var record = new Option<string>("--record") { Description = "Record file.", Required = true };
        var salt = new Option<string>("--salt") { Description = "Salt printed by seal (hex).", Required = true };
        var caseGps = new Option<string?>("--case-gps") { Description = "Optional case GPS time: also report blind injections overlapping it." };
        var arrival = new Option<string[]>("--arrival") { Description = "Site arrival time CODE=GPS (repeat per site)." };
        var margin = new Option<double>("--margin-s") { Description = "Margin around each injection, seconds.", DefaultValueFactory = _ => 1.0 };
        var json = new Option<bool>("--json") { Description = "Write {\"valid\": true|false} as JSON." };
        var command = new Command("unseal", "Verify a sealed record against its commitment and salt; exit 0 when valid, 1 when not.");
        foreach (var o in new Option[] { commitment, record, salt, caseGps, arrival, margin, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse => LocalCausesInput.Guard(() =>
        {
            var path = parse.GetValue(record)!;
            var bytes = File.Exists(path) ? File.ReadAllBytes(path) : throw new FileNotFoundException($"--record: file '{path}' not found");
            var valid = SealedRecord.Verify(parse.GetValue(commitment)!, bytes, parse.GetValue(salt)!);
            InjectionOverlapReport? overlaps = null;
            if (valid && parse.GetValue(caseGps) is { } g)
            {
                var arrivals = LocalCausesInput.Arrivals(parse.GetValue(arrival));
                try
                {
                    overlaps = InjectionOverlap.Find(BlindInjectionRecord.Parse(bytes, null), LocalCausesInput.Gps(g, "--case-gps"), arrivals, [], parse.GetValue(margin));
                }
                catch (FormatException ex)
                {
                    throw new FormatException($"--record {path}: {ex.Message}");
                }
            }

            if (parse.GetValue(json))
            {
                if (overlaps is null)
                {
                    CliOutput.WriteJson(new { valid });
                }
                else
                {
                    CliOutput.WriteJson(new { valid, overlaps });
                }
            }
            else
            {
                Console.Out.WriteLine(valid ? "valid" : "invalid");
                foreach (var h in overlaps?.Hits ?? [])
                {
                    Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"blind injection {h.Site} {h.Kind} {h.WaveformRef} [{h.StartGps}, {h.EndGps}] {h.Status}"));
                }
            }

            return valid ? CliOutput.Success : CliOutput.Negative;
        }));
        return command;
    }
}
