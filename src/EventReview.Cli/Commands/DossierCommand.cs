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
        command.Subcommands.Add(Export());
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

    private static Command Export()
    {
        var data = new DataOptions();
        var caseId = new Option<int?>("--case") { Description = "Numeric id of the case (see `cases list`)." };
        var output = new Option<string>("--out") { Description = "Path of the ZIP to write." };
        var command = new Command("export", "Export a case as a dossier ZIP (index.html, dossier.json, summary.pdf, attachments, pictures, manifest.json).");
        command.Options.Add(caseId);
        command.Options.Add(output);
        data.AddTo(command);
        command.SetAction(async (parse, ct) =>
        {
            if (parse.GetValue(caseId) is not { } id || string.IsNullOrWhiteSpace(parse.GetValue(output)))
            {
                return CliOutput.Fail("--case and --out are required.");
            }

            var path = Path.GetFullPath(parse.GetValue(output)!);
            var temp = path + ".partial";
            try
            {
                await using var provider = await data.OpenAsync(parse);
                var service = new EventReview.Dossier.CaseDossierService(
                    Microsoft.Extensions.DependencyInjection.ServiceProviderServiceExtensions.GetRequiredService<Microsoft.EntityFrameworkCore.IDbContextFactory<EventReview.Data.AppDbContext>>(provider),
                    Microsoft.Extensions.DependencyInjection.ServiceProviderServiceExtensions.GetRequiredService<EventReview.Data.AttachmentStore>(provider),
                    TimeProvider.System,
                    Microsoft.Extensions.DependencyInjection.ServiceProviderServiceExtensions.GetService<EventReview.Data.Records.RecordKeeping>(provider));
                EventReview.Core.Dossier.DossierExportRecord record;
                await using (var file = File.Create(temp))
                {
                    record = await service.ExportAsync(id, new EventReview.Core.Cases.Actor("cli", "command line"), file, ct);
                }

                File.Move(temp, path, overwrite: true);
                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(new { file = path, manifestSha256 = record.ManifestSha256, chainHead = record.ChainHead, sizeBytes = record.SizeBytes });
                }
                else
                {
                    Console.WriteLine($"Wrote {path} ({record.SizeBytes} bytes); manifest sha256 {record.ManifestSha256}");
                }

                return CliOutput.Success;
            }
            catch (KeyNotFoundException ex)
            {
                return CliOutput.Fail(ex.Message);
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or InvalidDataException)
            {
                return CliOutput.Fail($"{path}: {ex.Message}");
            }
            finally
            {
                // A failed export leaves no half-written file behind (after success the partial file was moved).
                if (File.Exists(temp))
                {
                    File.Delete(temp);
                }
            }
        });
        return command;
    }
}
