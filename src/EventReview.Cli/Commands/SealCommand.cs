using System.CommandLine;
using EventReview.Core.Cases;
using EventReview.Core.Injections;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview seal</c>: commitment to a blind-injection record file.</summary>
public static class SealCommand
{
    public static Command Build()
    {
        var record = new Option<string>("--record") { Description = "Record file, hashed byte for byte.", Required = true };
        var json = new Option<bool>("--json") { Description = "Write {\"commitment\", \"salt\", \"verdict\", \"reason\"} as JSON." };
        var command = new Command("seal", "Seal a record: prints SHA-256(salt || file) and the random 32-byte salt, both in hex.");
        command.Options.Add(record);
        command.Options.Add(json);
        command.SetAction(parse => LocalCausesInput.Guard(() =>
        {
            var path = parse.GetValue(record)!;
            var bytes = File.Exists(path) ? File.ReadAllBytes(path) : throw new FileNotFoundException($"--record: file '{path}' not found");
            var seal = SealedRecord.Seal(bytes);

            // the closing rule the app applies while this seal is registered and unopened
            var closing = BlindInjectionClosing.Decide(CaseOutcome.Astrophysical, [new SealState(Path.GetFileName(path), false, null)]);
            if (parse.GetValue(json))
            {
                CliOutput.WriteJsonWithVerdicts(new { seal.Commitment, seal.Salt, closing.Judgement });
            }
            else
            {
                Console.Out.WriteLine("commitment " + seal.Commitment);
                Console.Out.WriteLine("salt " + seal.Salt);
                Console.Out.WriteLine($"verdict: {closing.Judgement.Word} ({closing.Judgement.Reason})");
            }

            return CliOutput.Success;
        }));
        return command;
    }
}
