using System.CommandLine;
using EventReview.Dossier;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview dossier verify FILE.zip [--key PUBLIC_KEY_FILE] [--json]</c>: verifies an exported dossier offline
/// (manifest, file hashes, timeline chain, the contents against the timeline's facts, evidence fingerprints, sign-offs,
/// frozen configuration, index.html and the text of summary.pdf re-rendered from dossier.json) and its signature against
/// the trusted key: the file given with <c>--key</c> (PEM, or the JSON of <c>/api/signing-key</c>), else the public keys
/// of the configured key folder. Prints <c>valid</c>, <c>unsigned</c> (and why) or one problem per line; exit 0 only when
/// valid, 1 when unsigned or invalid, 2 when a file cannot be read.
/// <c>--json</c>: <c>{"status", "valid", "signedBy", "signature", "problems": [{file, where, what}]}</c>.
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
        var key = new Option<string>("--key") { Description = "Trusted public key: PEM, the JSON of /api/signing-key, or a record key folder. Default: the public keys of EventReview__Records__KeyDirectory, else keys/ in the data folder." };
        var command = new Command("verify", "Verify a dossier ZIP offline, without the database, against the server's public key.");
        command.Arguments.Add(file);
        command.Options.Add(json);
        command.Options.Add(key);
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
                var trusted = TrustedKeys(parse.GetValue(key));
                using var stream = File.OpenRead(path);
                result = DossierArchive.VerifyAsync(stream, trusted).GetAwaiter().GetResult();
            }
            catch (IOException ex)
            {
                return CliOutput.Fail($"{path}: {ex.Message}");
            }
            catch (InvalidDataException ex)
            {
                return CliOutput.Fail(ex.Message);
            }
            catch (Exception ex) when (ex is UnauthorizedAccessException or FormatException or System.Text.Json.JsonException or System.Security.Cryptography.CryptographicException or ArgumentException)
            {
                return CliOutput.Fail($"--key '{parse.GetValue(key)}': not a public key file (PEM, or the JSON of /api/signing-key) nor a record key folder: {EventReview.Core.Inputs.UserMessage.From(ex)}");
            }

            if (parse.GetValue(json))
            {
                CliOutput.WriteJson(new { status = result.Status, valid = result.Valid, signedBy = result.SignedBy, signature = result.Signature, problems = result.Problems });
            }
            else if (result.Valid)
            {
                Console.Out.WriteLine($"valid ({result.Signature})");
            }
            else
            {
                foreach (var p in result.Problems)
                {
                    Console.Out.WriteLine(p.ToString().ReplaceLineEndings(" "));
                }

                Console.Out.WriteLine($"{result.Status}: {result.Signature}");
            }

            return result.Valid ? CliOutput.Success : CliOutput.Negative;
        });
        return command;
    }

    /// <summary>The trusted public keys: the given file, else the configured key folder's list (none when there is none).</summary>
    private static IReadOnlyList<Core.Records.RecordPublicKey> TrustedKeys(string? file)
    {
        if (file is not null && Directory.Exists(file))
        {
            // A record key folder: its list of public keys (the private files are not read).
            using var folderRing = Data.Records.FileRecordKeyRing.Open(file);
            return folderRing.Keys;
        }

        if (file is not null)
        {
            return Data.Records.PublicKeyFile.Read(file);
        }

        var data = Environment.GetEnvironmentVariable("EventReview__DataDirectory") ?? "./data";
        var folder = Data.Records.RecordSettings.FromEnvironment(data).KeyDirectory;
        try
        {
            using var ring = Data.Records.FileRecordKeyRing.Open(folder);
            return ring.Keys;
        }
        catch (Exception ex) when (ex is InvalidDataException or UnauthorizedAccessException)
        {
            return [];
        }
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
