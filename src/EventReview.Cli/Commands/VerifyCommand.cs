using System.CommandLine;
using EventReview.Data;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview verify --data DIR [--case ID] [--json]</c>: recomputes every case's timeline chain and evidence
/// fingerprints, checks attachments on disk and the database's own integrity. Exit 0 when valid, 1 otherwise.
/// </summary>
public static class VerifyCommand
{
    public static Command Build()
    {
        var data = new DataOptions();
        var caseId = new Option<int?>("--case") { Description = "Verify one case (its numeric id) instead of all." };
        var verify = new Command("verify", "Verify the stored record: timeline hash chains, evidence, attachments, sign-offs.");
        verify.Options.Add(caseId);
        data.AddTo(verify);
        verify.SetAction(async (parse, ct) =>
        {
            try
            {
                await using var provider = await data.OpenAsync(parse);
                var (cases, database) = await provider.GetRequiredService<IntegrityVerifier>().VerifyAsync(parse.GetValue(caseId), ct);
                var problems = database.Concat(cases.SelectMany(c => c.Problems)).ToList();
                try
                {
                    // Coordinators hear of it through the web app's notifications; the report below stands either way.
                    await EventReview.Data.Notifications.VerifyFailureNotices.RecordAsync(provider, "eventreview verify", problems, ct);
                }
                catch (Exception ex) when (ex is Microsoft.EntityFrameworkCore.DbUpdateException or System.Data.Common.DbException or InvalidOperationException)
                {
                    Console.Error.WriteLine($"warning: the problems could not be recorded for the coordinators' notifications: {ex.Message}");
                }

                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(new
                    {
                        valid = problems.Count == 0,
                        problems = problems.Select(p => new { @case = p.Case, entry = p.Entry, item = p.Item, what = p.What }),
                    });
                }
                else if (problems.Count == 0)
                {
                    Console.WriteLine($"valid ({cases.Count} case(s), {cases.Sum(c => c.Entries)} timeline entries)");
                }
                else
                {
                    foreach (var p in problems)
                    {
                        Console.WriteLine($"{p.Case}{(p.Entry is null ? "" : $" entry {p.Entry}")}{(p.Item is null ? "" : $" item {p.Item}")}: {p.What}");
                    }
                }

                return problems.Count == 0 ? CliOutput.Success : CliOutput.Negative;
            }
            catch (KeyNotFoundException ex)
            {
                return CliOutput.Fail(ex.Message);
            }
            catch (ArgumentException ex)
            {
                return CliOutput.Fail(ex.Message.Split(" (Parameter", 2)[0]);
            }
        });
        return verify;
    }
}
