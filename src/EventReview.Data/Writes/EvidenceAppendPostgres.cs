using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using Npgsql;

namespace EventReview.Data.Writes;

/// <summary>
/// The short append (<see cref="EvidenceAppendSql"/>) on PostgreSQL, in as few round trips as the rules allow
/// (docs/decisions/014). PostgreSQL's single writer runs one unit after another, so round trips, not the statements'
/// work, set how many appends a second it stores. Here:
/// <list type="bullet">
/// <item>read: the row lock on the case, the head (<see cref="EvidenceAppendSql"/>'s query) and the item's fingerprint
/// lines, in one round trip;</item>
/// <item>write: the case and item updates (version-checked), the evidence row and the signed timeline entry, in one
/// round trip.</item>
/// </list>
/// With the writer's <see cref="ChainHeadCache"/>, an append to an item the writer appended to before skips the read;
/// with its <see cref="RoundTripPipe"/>, the round trips of a batch's units are shared. The entry goes to the next
/// sequence of the remembered head; if anything else added an entry to the case since (another instance, or another
/// path), the unique index on (case, sequence) refuses it, the round trip is undone, and the unit forgets the case and
/// reads it again. The version checks of the updates must then hold; if they do not, the unit's changes are already the
/// transaction's, so it throws <see cref="BatchAbortException"/> and the writer fails the whole batch (nothing of it is
/// stored, nobody is answered yes).
/// </summary>
internal static class EvidenceAppendPostgres
{
    /// <summary>Name of the unique index on the timeline's (case, sequence), as the migrations create it.</summary>
    public const string SequenceIndex = "IX_Timeline_ReviewCaseId_Sequence";

    private const string LockCaseSql = """SELECT 1 FROM "Cases" WHERE "Id" = @case FOR UPDATE""";

    private const string ItemLinesSql = """
        SELECT e."Kind", e."ContentSha256", e."AddedAt", e."Id" FROM "Evidence" e
        JOIN "ChecklistItems" i ON i."Id" = e."ChecklistItemId" WHERE i."ReviewCaseId" = @case AND i."Key" = @key ORDER BY e."AddedAt", e."Id"
        """;

    private const string ItemComputationsSql = """
        SELECT c."Kind", c."ParametersJson", c."InputFingerprint", c."ToolVersion", c."ResultJson", c."Verdict", c."RunAt" FROM "Computations" c
        JOIN "ChecklistItems" i ON i."Id" = c."ChecklistItemId" WHERE i."ReviewCaseId" = @case AND i."Key" = @key ORDER BY c."RunAt", c."Id"
        """;

    /// <summary>Adds evidence as <see cref="EvidenceAppendSql.TryAppendAsync"/> does, on PostgreSQL.</summary>
    internal static async Task<AppendedEvidence?> TryAppendAsync(SqlUnit unit, int caseId, string itemKey, Func<DateTimeOffset, EvidenceItem> make,
        Actor actor, DateTimeOffset now, CancellationToken ct)
    {
        var cache = unit.HeadCache;
        await unit.WaitForCaseAsync(caseId); // plan from what the units before this one stored
        var known = cache?.Find(caseId);
        if (known is not null && known.Items.TryGetValue(itemKey, out var item) && EvidenceAppend.Covers(Head(known, itemKey, item)))
        {
            try
            {
                var stored = await WriteAsync(unit, known, itemKey, item, make, actor, now, ct);
                cache!.CountHit();
                return stored;
            }
            catch (PostgresException ex) when (ex is { SqlState: PostgresErrorCodes.UniqueViolation, ConstraintName: SequenceIndex })
            {
                // Something else added to the case since this writer's last append (the round trip was undone, nothing
                // of it stored): forget the case and read it again.
                cache!.Forget(caseId);
                cache.CountStale();
            }
        }

        await unit.WaitForCaseAsync(caseId);
        var (head, read) = await ReadAsync(unit, caseId, itemKey, ct);
        if (!EvidenceAppend.Covers(Head(head, itemKey, read)) && head.State != CaseState.Closed)
        {
            return null;
        }

        return await WriteAsync(unit, head, itemKey, read, make, actor, now, ct);
    }

    private static EvidenceAppend.Head Head(ChainHeadCache.CaseHead c, string itemKey, ChainHeadCache.ItemHead i) =>
        new(c.CandidateId, c.State, itemKey, i.State, c.LastSequence, c.LastHash, i.CurrentSignOffs);

    /// <summary>Locks the case and reads its head and the item's fingerprint lines in one round trip.</summary>
    private static async Task<(ChainHeadCache.CaseHead Case, ChainHeadCache.ItemHead Item)> ReadAsync(SqlUnit unit, int caseId, string itemKey, CancellationToken ct)
    {
        ChainHeadCache.CaseHead? head = null;
        (int Id, ItemState State, int Version, int SignOffs)? item = null;
        var evidence = new List<(long, int, EvidenceLine)>();
        var computations = new List<ComputationLine>();
        (string, object?)[] keys = [("@case", caseId), ("@key", itemKey)];
        await unit.BatchAsync([(LockCaseSql, [("@case", caseId)]), (EvidenceAppendSql.HeadSql, keys), (ItemLinesSql, keys), (ItemComputationsSql, keys)], writes: false,
            async (result, r, token) =>
            {
                switch (result)
                {
                    case 1 when await r.ReadAsync(token):
                        head = new ChainHeadCache.CaseHead(r.GetInt32(0), r.GetString(1), Enum.Parse<CaseState>(r.GetString(2)), r.GetInt32(3),
                            r.IsDBNull(8) ? 0 : r.GetInt32(8), r.IsDBNull(9) ? TimelineEntry.GenesisHash : r.GetString(9));
                        item = r.IsDBNull(4) ? null : (r.GetInt32(4), Enum.Parse<ItemState>(r.GetString(5)), r.GetInt32(6), Convert.ToInt32(r.GetValue(7), System.Globalization.CultureInfo.InvariantCulture));
                        break;
                    case 2:
                        evidence.Clear(); // a round trip undone and sent again is read afresh
                        while (await r.ReadAsync(token))
                        {
                            var ticks = unit.ReadTime(r, 2).UtcTicks;
                            evidence.Add((ticks, r.GetInt32(3), new EvidenceLine(EvidenceFingerprint.KindName(Enum.Parse<EvidenceKind>(r.GetString(0))), r.GetString(1), ticks)));
                        }

                        break;
                    case 3:
                        computations.Clear();
                        while (await r.ReadAsync(token))
                        {
                            var sha = ComputationRecord.ComputeContentSha256(r.GetString(0), r.GetString(1), r.GetString(2), r.GetString(3), r.GetString(4), r.GetString(5));
                            computations.Add(new ComputationLine(sha, unit.ReadTime(r, 6).UtcTicks));
                        }

                        break;
                    default:
                        break;
                }
            }, ct, caseId);
        if (head is null)
        {
            throw new KeyNotFoundException($"There is no case with id {caseId}.");
        }

        if (item is not { } i)
        {
            throw new KeyNotFoundException($"Case {head.CandidateId} has no checklist item '{itemKey}'.");
        }

        var read = new ChainHeadCache.ItemHead(i.Id, i.State, i.Version, i.SignOffs, evidence, computations);
        if (unit.HeadCache?.Find(caseId) is { } known && known.Version == head.Version && known.LastSequence == head.LastSequence)
        {
            // Nothing changed the case since the writer last stored it: what it remembers of the other items still holds.
            foreach (var (key, other) in known.Items)
            {
                head.Items[key] = other;
            }
        }

        head.Items[itemKey] = read;
        return (head, read);
    }

    /// <summary>Plans the append from the head, signs its entry and stores everything in one round trip; the head then describes the case after it.</summary>
    private static async Task<AppendedEvidence> WriteAsync(SqlUnit unit, ChainHeadCache.CaseHead head, string itemKey, ChainHeadCache.ItemHead item,
        Func<DateTimeOffset, EvidenceItem> make, Actor actor, DateTimeOffset now, CancellationToken ct)
    {
        var evidence = make(now);
        var outcome = EvidenceAppend.Plan(Head(head, itemKey, item), evidence, actor, now);
        var e = outcome.Entry;
        unit.Sign(e);
        var evidenceId = 0;
        var affected = await unit.BatchAsync(
        [
            (EvidenceAppendSql.UpdateCaseSql, [("@state", outcome.CaseState.ToString()), ("@at", unit.Time(now)), ("@case", head.Id), ("@version", head.Version)]),
            (EvidenceAppendSql.UpdateItemSql, [("@state", outcome.ItemState.ToString()), ("@item", item.Id), ("@version", item.Version)]),
            (EvidenceAppendSql.InsertEvidenceSql, EvidenceAppendSql.EvidenceValues(unit, item.Id, evidence)),
            (EvidenceAppendSql.InsertTimelineSql, EvidenceAppendSql.TimelineValues(unit, head.Id, e)),
        ], writes: true, async (_, r, token) =>
        {
            if (await r.ReadAsync(token))
            {
                evidenceId = r.GetInt32(0);
            }
        }, ct, head.Id);
        if (affected[0] != 1 || affected[1] != 1 || evidenceId == 0)
        {
            unit.HeadCache?.Forget(head.Id);
            throw new BatchAbortException($"Case {head.CandidateId} changed while evidence was being added to '{itemKey}' although its timeline did not; the whole batch is undone.");
        }

        head.State = outcome.CaseState;
        head.Version++;
        head.LastSequence = e.Sequence;
        head.LastHash = e.Hash;
        item.State = outcome.ItemState;
        item.Version++;
        var ticks = evidence.AddedAt.UtcTicks - (evidence.AddedAt.UtcTicks % 10); // as stored: timestamp with time zone keeps whole microseconds
        item.AddEvidence(ticks, evidenceId, new EvidenceLine(EvidenceFingerprint.KindName(evidence.Kind), evidence.ContentSha256, ticks));
        unit.HeadCache?.Keep(head);
        return new AppendedEvidence(evidenceId, evidence, outcome.ItemState, item.Fingerprint());
    }
}
