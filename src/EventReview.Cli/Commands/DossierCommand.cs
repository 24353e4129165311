using System.CommandLine;
using EventReview.Dossier;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview dossier verify FILE.zip [--json]</c>: verifies an exported dossier offline (manifest, file hashes,
/// timeline chain, evidence fingerprints, sign-offs, frozen configuration). Prints <c>valid</c> or one problem per line;
/// exit 0 when valid, 1 when not, 2 when the file cannot be opened. <c>--json</c>: <c>{"valid": .., "problems": [{file, where, what}]}</c>.
/// </summary>
public static class DossierCommand
{
    public static Command Build()
    {
        var command = new Command("dossier", "Work with case dossiers (ZIP exports).");
        command.Subcommands.Add(Verify());
        return command;
    }

    private static Command Verify()
    {
        var file = new Argument<string>("file") { Description = "The dossier ZIP to verify." };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON." };
        var command = new Command("verify", "Verify a dossier ZIP offline, without the database.");
        command.Arguments.Add(file);
        command.Options.Add(json);
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            if (!File.Exists(path))
            {
                return CliOutput.Fail($"file '{path}' not found.");
            }

            Core.Dossier.DossierVerification result;
            try
            {
                using var stream = File.OpenRead(path);
                result = DossierArchive.VerifyAsync(stream).GetAwaiter().GetResult();
            }
            catch (IOException ex)
            {
                return CliOutput.Fail($"{path}: {ex.Message}");
            }

            if (parse.GetValue(json))
            {
                CliOutput.WriteJson(new { valid = result.Valid, problems = result.Problems });
            }
            else if (result.Valid)
            {
                Console.Out.WriteLine("valid");
            }
            else
            {
                foreach (var p in result.Problems)
                {
                    Console.Out.WriteLine(p.ToString().ReplaceLineEndings(" "));
                }
            }

            return result.Valid ? CliOutput.Success : CliOutput.Negative;
        });
        return command;
    }
}
