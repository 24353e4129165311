using System.CommandLine;
using System.Globalization;
using EventReview.Data;
using EventReview.Data.Backup;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview restore --in FILE --data DIR [--keys DIR] [--witness DIR] [--force] [--allow-invalid] [--json]</c>:
/// checks the archive against its manifest, unpacks it beside the target, verifies the whole record (timelines, their
/// signatures under the record key, recomputed rows, attachments, the witnessed heads) and only then moves it into place. Exit 0 when restored and valid, 1 when the restored copy fails verification (problems
/// listed), 2 when refused (non-empty target without --force, unsafe or altered archive entry, wrong provider).
/// </summary>
public static class RestoreCommand
{
    public static Command Build()
    {
        var data = new DataOptions();
        var input = new Option<string>("--in") { Description = "Backup file made by 'eventreview backup'.", Required = true };
        var force = new Option<bool>("--force") { Description = "Replace a non-empty data folder (it is moved aside to DIR.before-restore-..., not deleted)." };
        var allowInvalid = new Option<bool>("--allow-invalid") { Description = "Place the restored copy even when verification finds problems (exit code stays 1)." };
        var restore = new Command("restore", "Restore a backup into a data folder and verify the whole record.");
        restore.Options.Add(input);
        restore.Options.Add(force);
        restore.Options.Add(allowInvalid);
        data.AddTo(restore);
        restore.SetAction(async (parse, ct) =>
        {
            try
            {
                var options = new RestoreOptions(parse.GetValue(force), parse.GetValue(allowInvalid), Records: data.RecordSettings(parse));
                var report = await BackupRestorer.RestoreAsync(parse.GetValue(input)!, data.Settings(parse), options, ct);
                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(report);
                }
                else
                {
                    WriteText(report);
                }

                return report.Valid ? CliOutput.Success : CliOutput.Negative;
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
        return restore;
    }

    private static void WriteText(RestoreReport report)
    {
        foreach (var p in report.Problems)
        {
            Console.WriteLine($"{p.Case}{(p.Entry is null ? "" : $" entry {p.Entry}")}{(p.Item is null ? "" : $" item {p.Item}")}: {p.What}");
        }

        var what = string.Create(CultureInfo.InvariantCulture,
            $"{report.CaseCount} case(s), {report.TimelineEntries} timeline entries, {report.AttachmentCount} attachment(s), {report.Files} files, {report.Bytes} bytes");
        if (report.Valid)
        {
            Console.WriteLine($"restored {what} into {report.TargetPath}; verification: valid");
        }
        else if (report.Placed)
        {
            Console.WriteLine($"restored {what} into {report.TargetPath}; verification FAILED: {report.Problems.Count} problem(s) listed above");
        }
        else
        {
            Console.WriteLine($"verification FAILED: {report.Problems.Count} problem(s) listed above; nothing was placed in {report.TargetPath} (--allow-invalid places it anyway)");
        }

        foreach (var note in report.Notes ?? [])
        {
            Console.WriteLine("note: " + note);
        }

        if (report.PreviousFolderMovedTo is not null)
        {
            Console.WriteLine($"the previous folder was moved to {report.PreviousFolderMovedTo}");
        }
    }
}
