using EventReview.Core.Cases;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>
/// Verifies stored cases (one or all): the database's own integrity check (SQLite), the sign-in audit chain (when
/// verifying all), then each case's timeline chain, evidence, attachments on disk, computation records and sign-offs
/// (see <see cref="CaseIntegrity"/>).
/// </summary>
public sealed class IntegrityVerifier(IDbContextFactory<AppDbContext> dbFactory, AttachmentStore store, DatabaseSettings settings)
{
    /// <summary>Result for one case.</summary>
    public sealed record CaseResult(int Id, string CandidateId, int Entries, string? ChainHead, IReadOnlyList<IntegrityProblem> Problems)
    {
        public bool Valid => Problems.Count == 0;
    }

    /// <summary>Verifies every case (or just <paramref name="caseId"/>); database-level problems are reported with case "(database)".</summary>
    public async Task<(IReadOnlyList<CaseResult> Cases, IReadOnlyList<IntegrityProblem> Database)> VerifyAsync(int? caseId = null, CancellationToken ct = default)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var database = new List<IntegrityProblem>();
        if (settings.Provider == DatabaseProvider.Sqlite)
        {
            var connection = db.Database.GetDbConnection();
            await connection.OpenAsync(ct);
            await using var cmd = connection.CreateCommand();
            cmd.CommandText = "PRAGMA integrity_check;";
            var answer = (await cmd.ExecuteScalarAsync(ct))?.ToString();
            if (!string.Equals(answer, "ok", StringComparison.OrdinalIgnoreCase))
            {
                database.Add(new IntegrityProblem("(database)", null, null, $"SQLite integrity check failed: {answer}"));
            }
        }

        var ids = caseId is { } one ? [one] : await db.Cases.OrderBy(c => c.Id).Select(c => c.Id).ToListAsync(ct);
        if (caseId is not null && !await db.Cases.AnyAsync(c => c.Id == caseId, ct))
        {
            throw new KeyNotFoundException($"There is no case with id {caseId}.");
        }

        if (caseId is null && await Auth.AccountAudit.FirstProblemInAsync(db, ct) is { } audit)
        {
            database.Add(new IntegrityProblem("(sign-in audit)", null, null, audit));
        }

        var results = new List<CaseResult>();
        foreach (var id in ids)
        {
            await using var each = await dbFactory.CreateDbContextAsync(ct);
            var c = await each.CasesWithEverything().AsNoTracking().FirstAsync(x => x.Id == id, ct);
            var problems = CaseIntegrity.Verify(c, store.Verify);
            results.Add(new CaseResult(c.Id, c.CandidateId, c.Activity.Count, c.Activity.MaxBy(a => a.Sequence)?.Hash, problems));
        }

        return (results, database);
    }
}
