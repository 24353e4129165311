using System.CommandLine;
using System.Globalization;
using EventReview.Core.Cases;
using EventReview.Core.Injections;
using EventReview.Core.Verdicts;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview unseal</c>: verifies a sealed record; with a case time also looks up its blind injections at the case and says,
/// with the app's closing rule (<see cref="BlindInjectionClosing"/>), whether the case may be closed as astrophysical.
/// </summary>
public static class UnsealCommand
{
    public static Command Build()
    {
        var commitment = new Option<string>("--commitment") { Description = "Commitment printed by seal (hex).", Required = true };
        var record = new Option<string>("--record") { Description = "Record file.", Required = true };
        var salt = new Option<string>("--salt") { Description = "Salt printed by seal (hex).", Required = true };
        var caseGps = new Option<string?>("--case-gps") { Description = "Optional case GPS time: also report blind injections overlapping it and the closing rule." };
        var arrival = new Option<string[]>("--arrival") { Description = "Site arrival time CODE=GPS (repeat per site)." };
        var margin = new Option<double>("--margin-s") { Description = "Margin around each injection, seconds (the app uses 10).", DefaultValueFactory = _ => BlindInjectionClosing.MarginSeconds };
        var json = new Option<bool>("--json") { Description = "Write {\"valid\", \"verdict\", \"reason\"} (and the overlaps) as JSON." };
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
            var judgement = valid
                ? new Judgement(Verdict.SealValid, "SHA-256(salt + record) equals the commitment")
                : new Judgement(Verdict.SealInvalid, "the record or salt does not match the commitment; nothing is revealed");
            InjectionOverlapReport? overlaps = null;
            Core.Time.LeapSecondNotice? leap = null;
            if (valid && parse.GetValue(caseGps) is { } g)
            {
                var t0 = LocalCausesInput.Gps(g, "--case-gps");
                SealState state;
                try
                {
                    state = BlindInjectionClosing.StateOf(Path.GetFileName(path), bytes, t0, LocalCausesInput.Arrivals(parse.GetValue(arrival)), parse.GetValue(margin));
                }
                catch (FormatException ex)
                {
                    throw new FormatException($"--record {path}: {ex.Message}");
                }

                overlaps = state.ComparisonWithCase;
                judgement = BlindInjectionClosing.Decide(CaseOutcome.Astrophysical, [state]).Judgement;
                leap = LocalCausesInput.Leap(t0);
            }

            if (parse.GetValue(json))
            {
                CliOutput.WriteJsonWithVerdicts(new { valid, judgement, overlaps, caseUtc = leap?.Utc, leapSeconds = leap });
            }
            else
            {
                if (leap is not null)
                {
                    LocalCausesInput.WarnLeap(leap);
                }

                Console.Out.WriteLine(valid ? "valid" : "invalid");
                foreach (var h in overlaps?.Hits ?? [])
                {
                    Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture, $"blind injection {h.Site} {h.Kind} {h.WaveformRef} [{h.StartGps}, {h.EndGps}] {h.Status}"));
                }

                Console.Out.WriteLine($"verdict: {judgement.Word} ({judgement.Reason})");
            }

            return valid ? CliOutput.Success : CliOutput.Negative;
        }));
        return command;
    }
}
