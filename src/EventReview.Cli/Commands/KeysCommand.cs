using System.CommandLine;
using EventReview.Core.Records;
using EventReview.Data.Records;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview keys show|rotate|export</c>: the record key folder (<c>--keys DIR</c>, else
/// <c>EventReview__Records__KeyDirectory</c>, else <c>keys/</c> in the data folder). <c>show</c> lists every key with its
/// fingerprint and validity; <c>rotate</c> ends the current key's validity and starts a new one (old keys keep verifying
/// what they signed; restart the app to sign with the new key); <c>export --out FILE</c> writes the public keys as JSON
/// (the format of <c>/api/signing-key</c>, for <c>dossier verify --key</c>).
/// </summary>
public static class KeysCommand
{
    public static Command Build()
    {
        var command = new Command("keys", "The record key folder: list, rotate or export the public keys.");
        command.Subcommands.Add(Show());
        command.Subcommands.Add(Rotate());
        command.Subcommands.Add(Export());
        return command;
    }

    private static Command Show()
    {
        var data = new DataOptions();
        var show = new Command("show", "List the record keys with their fingerprints and validity.");
        data.AddTo(show);
        show.SetAction(parse => Run(data, parse, ring =>
        {
            if (parse.GetValue(data.Json))
            {
                CliOutput.WriteJson(ring.Keys.Select(k => new { fingerprint = k.Fingerprint, validFrom = k.ValidFrom, validUntil = k.ValidUntil, current = k.ValidUntil is null }));
            }
            else if (ring.Keys.Count == 0)
            {
                Console.WriteLine($"no record key in {ring.Folder}");
            }
            else
            {
                foreach (var k in ring.Keys)
                {
                    Console.WriteLine($"{k.Fingerprint}  {(k.ValidUntil is null ? "current" : "retired")}  from {k.ValidFrom:yyyy-MM-dd HH:mm} UTC{(k.ValidUntil is { } u ? $" until {u:yyyy-MM-dd HH:mm} UTC" : string.Empty)}");
                }
            }

            return CliOutput.Success;
        }));
        return show;
    }

    private static Command Rotate()
    {
        var data = new DataOptions();
        var rotate = new Command("rotate", "Start a new record key; the old one is kept and keeps verifying what it signed. Restart the app afterwards.");
        data.AddTo(rotate);
        rotate.SetAction(parse => Run(data, parse, ring =>
        {
            if (ring.Current is null && ring.Keys.Count == 0)
            {
                return CliOutput.Fail($"there is no record key in {ring.Folder} to rotate (the app makes the first one on its first start).");
            }

            var fingerprint = ring.Rotate(TimeProvider.System.GetUtcNow());
            Console.WriteLine($"new record key {fingerprint}; restart the app so that it signs with it. Keep a copy of {ring.Folder} elsewhere.");
            return CliOutput.Success;
        }));
        return rotate;
    }

    private static Command Export()
    {
        var data = new DataOptions();
        var output = new Option<string>("--out") { Description = "File to write the public keys to (JSON, as /api/signing-key answers).", Required = true };
        var export = new Command("export", "Write the public keys (never a private key) for checking dossiers elsewhere.");
        export.Options.Add(output);
        data.AddTo(export);
        export.SetAction(parse => Run(data, parse, ring =>
        {
            File.WriteAllText(parse.GetValue(output)!, System.Text.Json.JsonSerializer.Serialize(PublicKeyFile.Describe(ring), CliOutput.Json) + "\n");
            Console.WriteLine($"wrote {ring.Keys.Count} public key(s) to {parse.GetValue(output)}");
            return CliOutput.Success;
        }));
        return export;
    }

    private static int Run(DataOptions data, ParseResult parse, Func<FileRecordKeyRing, int> action)
    {
        try
        {
            using var ring = FileRecordKeyRing.Open(data.RecordSettings(parse).KeyDirectory);
            return action(ring);
        }
        catch (Exception ex) when (ex is InvalidDataException or IOException or UnauthorizedAccessException or ArgumentException)
        {
            return CliOutput.Fail(ex.Message);
        }
    }
}
