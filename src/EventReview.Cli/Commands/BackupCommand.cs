using System.CommandLine;
using System.Globalization;
using EventReview.Data;
using EventReview.Data.Backup;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview backup --data DIR --out FILE [--force] [--json]</c>: a consistent online backup of a data folder
/// (SQLite snapshot plus every attachment, with a manifest of SHA-256 hashes), safe while the app runs. With
/// <c>--provider Postgres --connection ...</c> only the attachments are archived (checked against the live database's
/// references) and the user is told to dump the database with pg_dump first. Exit 0 on success, 2 when refused or failed.
/// </summary>
public static class BackupCommand
{
    public static Command Build()
    {
        var data = new DataOptions();
        var output = new Option<string>("--out") { Description = "Backup file to write (a ZIP); written as FILE.partial and renamed at the end.", Required = true };
        var force = new Option<bool>("--force") { Description = "Replace the output file if it exists." };
        var backup = new Command("backup", "Back up the database and attachments into one archive (safe while the app is running).");
        backup.Options.Add(output);
        backup.Options.Add(force);
        data.AddTo(backup);
        backup.SetAction(async (parse, ct) =>
        {
            try
            {
                var report = await BackupWriter.CreateAsync(data.Settings(parse), parse.GetValue(output)!, new BackupOptions(parse.GetValue(force)), ct);
                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(report);
                }
                else
                {
                    Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                        $"backed up {report.CaseCount} case(s), {report.TimelineEntries} timeline entries, {report.AttachmentCount} attachment(s): "
                        + $"{report.Files} files, {report.Bytes} bytes ({report.ArchiveBytes} bytes packed) to {report.OutputPath} in {report.DurationSeconds:F1} s"));
                    if (report.Note is not null)
                    {
                        Console.WriteLine("note: " + report.Note);
                    }
                }

                return CliOutput.Success;
            }
            catch (BackupException ex)
            {
                return CliOutput.Fail(ex.Message);
            }
            catch (ArgumentException ex)
            {
                return CliOutput.Fail(UserMessage.From(ex));
            }
            catch (IOException ex)
            {
                return CliOutput.Fail(ex.Message);
            }
        });
        return backup;
    }
}
