using System.CommandLine;
using EventReview.Core.Checklists;
using EventReview.Data;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview cases list [--json]</c>: id, candidate id, GPS time and state of every case.</summary>
public static class CasesCommand
{
    public static Command Build()
    {
        var cases = new Command("cases", "Read cases.");
        var data = new DataOptions();
        var list = new Command("list", "List cases, newest candidate first.");
        data.AddTo(list);
        list.SetAction(async (parse, ct) =>
        {
            try
            {
                await using var provider = await data.OpenAsync(parse, writes: false);
                await using var db = await provider.GetRequiredService<IDbContextFactory<AppDbContext>>().CreateDbContextAsync(ct);
                var all = await db.Cases.AsNoTracking().OrderByDescending(c => c.GpsNanoseconds).ToListAsync(ct);
                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(all.Select(c => new { id = c.Id, candidateId = c.CandidateId, gpsTime = c.GpsNanoseconds / 1_000_000_000m, state = StateNames.Of(c.State).Replace(' ', '-') }));
                }
                else
                {
                    foreach (var c in all)
                    {
                        Console.WriteLine($"{c.Id,5}  {c.CandidateId,-24} GPS {c.Gps,-22} {StateNames.Of(c.State)}");
                    }
                }

                return CliOutput.Success;
            }
            catch (ArgumentException ex)
            {
                return CliOutput.Fail(UserMessage.From(ex));
            }
        });
        cases.Subcommands.Add(list);
        return cases;
    }
}
