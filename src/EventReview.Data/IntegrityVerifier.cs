using EventReview.Core.Cases;
using EventReview.Core.Records;
using EventReview.Data.Records;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>
/// Verifies stored cases (one or all) against their signed record: the database's own integrity check (SQLite); every
/// stored value readable (<see cref="StoredValueScan"/>, whole database); the sign-in audit chain, its MACs and the
/// accounts, roles, tokens and sealed records it accounts for (<see cref="Auth.AuditReplay"/>); each case's timeline
/// chain, MACs, recomputed rows, notes, attachments and sign-offs (<see cref="CaseIntegrity"/>); and every chain's newest
/// witnessed head (<see cref="HeadWitness"/>), so removing the newest entries, or a whole case, is caught.
/// </summary>
public sealed class IntegrityVerifier(IDbContextFactory<AppDbContext> dbFactory, AttachmentStore store, DatabaseSettings settings, RecordKeeping? records = null)
{
    /// <summary>Result for one case.</summary>
    public sealed record CaseResult(int Id, string CandidateId, int Entries, string? ChainHead, IReadOnlyList<IntegrityProblem> Problems)
    {
        public bool Valid => Problems.Count == 0;
    }

    private readonly IRecordKeyRing _keys = records?.Keys ?? FileRecordKeyRing.PublicOnly([]);

    /// <summary>The record keys used (their fingerprints are shown with every result).</summary>
    public IRecordKeyRing Keys => _keys;

    /// <summary>The witness used, or null when none is configured.</summary>
    public HeadWitness? Witness => records?.Witness;

    /// <summary>
    /// Verifies every case (or just <paramref name="caseId"/>); database-level problems are reported with case "(database)",
    /// "(sign-in audit)", "(witness)" or "(stored values)". With <paramref name="witnessedBefore"/> (a backup's time), only
    /// heads witnessed before then must be present: later entries are not expected in a copy taken at that time.
    /// </summary>
    public async Task<(IReadOnlyList<CaseResult> Cases, IReadOnlyList<IntegrityProblem> Database)> VerifyAsync(int? caseId = null,
        DateTimeOffset? witnessedBefore = null, CancellationToken ct = default)
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

        if (caseId is not null && !await db.Cases.AnyAsync(c => c.Id == caseId, ct))
        {
            throw new KeyNotFoundException($"There is no case with id {caseId}.");
        }

        var witness = records?.Witness.Read(witnessedBefore);
        if (caseId is null)
        {
            database.AddRange(await StoredValueScan.FindAsync(db, ct));
            database.AddRange(await AuditAsync(db, witness, ct));
            if (records is null)
            {
                database.Add(new IntegrityProblem("(witness)", null, null, "No key folder or witness is configured: signatures and truncation cannot be checked."));
            }
            else if (witness is { Exists: false } && (await db.Timeline.AnyAsync(ct) || await db.AccountEvents.AnyAsync(ct)))
            {
                database.Add(new IntegrityProblem("(witness)", null, null, $"The witness file {witness.Path} does not exist: the newest entries of each case cannot be checked against it."));
            }
        }

        if (witness is not null)
        {
            database.AddRange(witness.Problems.Select(p => new IntegrityProblem("(witness)", null, null, p)));
        }

        var ids = caseId is { } one ? [one] : await db.Cases.OrderBy(c => c.Id).Select(c => c.Id).ToListAsync(ct);
        var results = new List<CaseResult>();
        foreach (var id in ids)
        {
            var result = await VerifyCaseAsync(id, witness, ct);
            Telemetry.ReviewMetrics.CaseVerified(result.Valid);
            results.Add(result);
        }

        if (caseId is null && witness is not null)
        {
            var present = (await db.Cases.Select(c => c.CandidateId).ToListAsync(ct)).Select(EntryMac.CaseChain).ToHashSet(StringComparer.Ordinal);
            foreach (var (chain, seen) in witness.Newest.Where(w => w.Key.StartsWith("case:", StringComparison.Ordinal) && !present.Contains(w.Key)))
            {
                database.Add(new IntegrityProblem(chain[5..], (int)seen.Head.Sequence, null,
                    $"Case {chain[5..]} is missing from the database: the witness saw its timeline at entry {seen.Head.Sequence} on {seen.At}."));
            }
        }

        return (results, database);
    }

    private async Task<CaseResult> VerifyCaseAsync(int id, WitnessReading? witness, CancellationToken ct)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        ReviewCase c;
        try
        {
            c = await db.CasesWithEverything().AsNoTracking().FirstAsync(x => x.Id == id, ct);
        }
        catch (Exception ex) when (ex is InvalidOperationException or InvalidCastException or FormatException or ArgumentException or OverflowException)
        {
            var name = await db.Cases.Where(x => x.Id == id).Select(x => x.CandidateId).FirstOrDefaultAsync(ct) ?? $"case id {id}";
            return new CaseResult(id, name, 0, null, [new IntegrityProblem(name, null, null,
                $"The case cannot be loaded: a stored value cannot be read ({ex.Message}). Run the whole-database check to see which value to repair.")]);
        }

        var problems = new List<IntegrityProblem>();
        try
        {
            var configurations = await db.ConfigurationSnapshots.AsNoTracking().Where(s => s.ReviewCaseId == id).ToListAsync(ct);
            problems.AddRange(CaseIntegrity.Verify(c, store.Verify, _keys, configurations));
        }
        catch (Exception ex) when (ex is InvalidOperationException or InvalidCastException or FormatException or ArgumentException or OverflowException or System.Text.Json.JsonException)
        {
            problems.Add(new IntegrityProblem(c.CandidateId, null, null, $"The case could not be checked completely: {ex.Message}"));
        }

        if (witness?.Newest.TryGetValue(EntryMac.CaseChain(c.CandidateId), out var seen) == true)
        {
            var entries = c.Timeline.ToDictionary(a => (long)a.Sequence, a => a.Hash);
            var last = c.Timeline.Count == 0 ? 0 : c.Timeline.Max(a => a.Sequence);
            // The witness speaks about the timeline itself: its finding goes right after the chain's own, before the
            // field comparisons (which removed entries usually explain).
            var at = problems.TakeWhile(p => p.What.StartsWith("Timeline:", StringComparison.Ordinal)).Count();
            if (!entries.TryGetValue(seen.Head.Sequence, out var hash))
            {
                problems.Insert(at, new IntegrityProblem(c.CandidateId, (int)seen.Head.Sequence, null,
                    $"Timeline: the newest entries were removed: the witness saw entry {seen.Head.Sequence} (hash {Short(seen.Head.Hash)}) on {seen.At}, but the timeline ends at entry {last}."));
            }
            else if (hash != seen.Head.Hash)
            {
                problems.Insert(at, new IntegrityProblem(c.CandidateId, (int)seen.Head.Sequence, null,
                    $"Timeline: entry {seen.Head.Sequence} is not the one the witness saw on {seen.At} (hash {Short(seen.Head.Hash)}, now {Short(hash)}): the timeline was rewritten."));
            }
        }

        return new CaseResult(c.Id, c.CandidateId, c.Timeline.Count, c.Timeline.MaxBy(a => a.Sequence)?.Hash, problems);
    }

    private async Task<IReadOnlyList<IntegrityProblem>> AuditAsync(AppDbContext db, WitnessReading? witness, CancellationToken ct)
    {
        const string Name = "(sign-in audit)";
        var problems = new List<IntegrityProblem>();
        if (await Auth.AccountAudit.FirstProblemInAsync(db, ct) is { } chain)
        {
            problems.Add(new IntegrityProblem(Name, null, null, chain));
        }

        var events = await db.AccountEvents.AsNoTracking().OrderBy(e => e.Sequence).ToListAsync(ct);
        if (events.FirstOrDefault(e => e.MacMatches(_keys) != true) is { } bad)
        {
            problems.Add(new IntegrityProblem(Name, (int)bad.Sequence, null, bad.KeyId is null
                ? $"Sign-in audit entry {bad.Sequence} ({bad.Kind}) carries no signature: it was not written by this server with its record key."
                : bad.MacMatches(_keys) is null
                    ? $"Sign-in audit entry {bad.Sequence} is signed with key {Short(bad.KeyId)}, which is not in the key ring."
                    : $"Sign-in audit entry {bad.Sequence} ({bad.Kind}) does not match its signature: it was altered, and perhaps re-hashed, without the record key."));
        }

        problems.AddRange(Auth.AuditReplay.Compare(events, await Auth.AccountAdmin.StoredFactsAsync(db, ct)).Select(p => new IntegrityProblem(Name, null, null, p)));
        if (witness?.Newest.TryGetValue(EntryMac.AuditChain, out var seen) == true)
        {
            var entry = events.FirstOrDefault(e => e.Sequence == seen.Head.Sequence);
            if (entry is null)
            {
                problems.Add(new IntegrityProblem(Name, (int)seen.Head.Sequence, null,
                    $"The newest sign-in audit entries were removed: the witness saw entry {seen.Head.Sequence} on {seen.At}, but the audit ends at entry {(events.Count == 0 ? 0 : events[^1].Sequence)}."));
            }
            else if (entry.Hash != seen.Head.Hash)
            {
                problems.Add(new IntegrityProblem(Name, (int)seen.Head.Sequence, null, $"Sign-in audit entry {seen.Head.Sequence} is not the one the witness saw on {seen.At}: the audit was rewritten."));
            }
        }

        return problems;
    }

    private static string Short(string? hash) => hash is null ? "(none)" : hash.Length > 12 ? hash[..12] : hash;
}
