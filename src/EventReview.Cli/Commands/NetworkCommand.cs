using System.CommandLine;
using EventReview.Core.Network;
using EventReview.Data;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview network import --file network.json</c> (replaces the stored network; a malformed file changes nothing and
/// the message names the file and the field) and <c>network export [--file F]</c> (the same format, to a file or standard output).
/// </summary>
public static class NetworkCommand
{
    public static Command Build()
    {
        var network = new Command("network", "Import or export the detector network (the network.json format of the Network page).");
        network.Subcommands.Add(BuildImport());
        network.Subcommands.Add(BuildExport());
        return network;
    }

    private static Command BuildImport()
    {
        var data = new DataOptions();
        var file = new Option<string>("--file") { Description = "The network.json file to import; it replaces every stored site." };
        var import = new Command("import", "Replace the stored network with the one in a network.json file (all or nothing).");
        import.Options.Add(file);
        data.AddTo(import);
        import.SetAction(async (parse, ct) =>
        {
            var path = parse.GetValue(file);
            if (string.IsNullOrWhiteSpace(path))
            {
                return CliOutput.Fail("--file is required (the network.json to import).");
            }

            NetworkDefinition definition;
            try
            {
                definition = NetworkFile.Parse(await File.ReadAllTextAsync(path, ct));
            }
            catch (Exception ex) when (ex is FormatException or IOException or UnauthorizedAccessException)
            {
                // Checked before the database is opened: a bad file changes nothing.
                return CliOutput.Fail($"{path}: {Reason(ex)} Nothing was changed.");
            }

            await using var provider = await data.OpenAsync(parse);
            await using var db = await provider.GetRequiredService<IDbContextFactory<AppDbContext>>().CreateDbContextAsync(ct);
            await NetworkStore.ReplaceAsync(db, definition.Name, definition.Sites, ct);
            if (parse.GetValue(data.Json))
            {
                CliOutput.WriteJson(new { name = definition.Name, sites = definition.Sites.Select(s => s.Code).ToList() });
            }
            else
            {
                Console.WriteLine($"Imported network '{definition.Name}' with {definition.Sites.Count} site(s): {string.Join(", ", definition.Sites.Select(s => s.Code))}.");
            }

            return CliOutput.Success;
        });
        return import;
    }

    private static Command BuildExport()
    {
        var data = new DataOptions();
        var file = new Option<string>("--file") { Description = "Write to this file instead of standard output." };
        var export = new Command("export", "Write the stored network as network.json (the format 'network import' reads).");
        export.Options.Add(file);
        data.AddTo(export);
        export.SetAction(async (parse, ct) =>
        {
            await using var provider = await data.OpenAsync(parse, writes: false);
            await using var db = await provider.GetRequiredService<IDbContextFactory<AppDbContext>>().CreateDbContextAsync(ct);
            var definition = await NetworkStore.ReadAsync(db, ct);
            if (definition.Sites.Count == 0)
            {
                return CliOutput.Fail("No network is stored yet; import one with 'eventreview network import --file network.json'.");
            }

            var json = NetworkFile.Write(definition);
            if (parse.GetValue(file) is { Length: > 0 } path)
            {
                await File.WriteAllTextAsync(path, json + "\n", ct);
                Console.Error.WriteLine($"Wrote network '{definition.Name}' ({definition.Sites.Count} site(s)) to {path}.");
            }
            else
            {
                Console.WriteLine(json);
            }

            return CliOutput.Success;
        });
        return export;
    }

    private static string Reason(Exception ex) => ex switch
    {
        FileNotFoundException => "no such file.",
        DirectoryNotFoundException => "no such folder.",
        UnauthorizedAccessException => "not readable (permission denied).",
        _ => ex.Message.TrimEnd('.') + ".",
    };
}
