using System.CommandLine;
using EventReview.Data;
using Microsoft.Extensions.DependencyInjection;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview verify --data DIR [--keys DIR] [--witness DIR] [--case ID] [--json]</c>: recomputes every case's
/// timeline chain and checks each entry's signature under the record key, recomputes the stored rows from the
/// timeline's facts (missing and unaccounted rows), checks attachments on disk, the sign-in audit and the accounts,
/// roles, tokens and sealed records it accounts for, every stored value's readability, the database's own integrity
/// and each chain's newest witnessed head. Prints the record key's fingerprint and the witness used. Exit 0 when
/// valid, 1 otherwise.
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
                await using var provider = await data.OpenAsync(parse, writes: false);
                var verifier = provider.GetRequiredService<IntegrityVerifier>();
                var (cases, database) = await verifier.VerifyAsync(parse.GetValue(caseId), ct: ct);
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

                var witness = verifier.Witness?.Read();
                var keys = verifier.Keys.Keys;
                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(new
                    {
                        valid = problems.Count == 0,
                        keys = keys.Select(k => new { fingerprint = k.Fingerprint, validFrom = k.ValidFrom, validUntil = k.ValidUntil }),
                        witness = witness is null ? null : new { path = witness.Path, exists = witness.Exists, lines = witness.Lines, newest = witness.LastAt },
                        problems = problems.Select(p => new { @case = p.Case, entry = p.Entry, item = p.Item, what = p.What }),
                    });
                    return problems.Count == 0 ? CliOutput.Success : CliOutput.Negative;
                }

                foreach (var k in keys)
                {
                    Console.WriteLine($"record key {k.Fingerprint} ({(k.ValidUntil is null ? "current" : "retired")}, from {k.ValidFrom:yyyy-MM-dd HH:mm} UTC{(k.ValidUntil is { } until ? $" until {until:yyyy-MM-dd HH:mm} UTC" : string.Empty)})");
                }

                if (keys.Count == 0)
                {
                    Console.WriteLine($"record key: none found in {data.RecordSettings(parse).KeyDirectory}");
                }

                Console.WriteLine(witness is null ? "witness: none" : witness.Exists
                    ? $"witness {witness.Path} ({witness.Lines} lines, newest written {witness.LastAt:yyyy-MM-dd HH:mm:ss} UTC)"
                    : $"witness {witness.Path} (missing)");
                if (problems.Count == 0)
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
                return CliOutput.Fail(UserMessage.From(ex));
            }
        });
        return verify;
    }
}
