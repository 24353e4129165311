using System.Data.Common;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;

namespace EventReview.Data.Writes;

/// <summary>What a short append stored: the evidence (with its new id), the item's state and evidence fingerprint after it.</summary>
public sealed record AppendedEvidence(int EvidenceId, EvidenceItem Evidence, ItemState ItemState, string ItemFingerprint);

/// <summary>
/// The short path for adding evidence, the most frequent write: instead of loading the case, it reads the few values
/// the change depends on (<see cref="EvidenceAppend.Head"/>), lets the domain rules (<see cref="EvidenceAppend.Plan"/>)
/// decide, and stores the evidence row, the timeline entry and the new versions and states with four prepared
/// statements. The rows are the same as the loaded case would store, facts and signature included (a test compares
/// them); the unit signs the timeline entry and notes its head for the witness. It does not cover an item
/// with current sign-offs; for that it stores nothing and returns null, and the caller takes the full path.
/// Run it inside <see cref="IWriteGate.RunSqlAsync"/>: on PostgreSQL it takes <see cref="EvidenceAppendPostgres"/>'s
/// route (the same plan and rows, in fewer round trips, with the row lock on the case); on SQLite the single writer
/// already excludes every other writer.
/// </summary>
public static class EvidenceAppendSql
{
    internal const string HeadSql = """
        SELECT c."Id", c."CandidateId", c."State", c."Version", i."Id", i."State", i."Version",
               (SELECT COUNT(*) FROM "SignOffs" s WHERE s."ChecklistItemId" = i."Id" AND NOT s."IsStale"),
               a."Sequence", a."Hash"
        FROM "Cases" c
        LEFT JOIN "ChecklistItems" i ON i."ReviewCaseId" = c."Id" AND i."Key" = @key
        LEFT JOIN "Timeline" a ON a."ReviewCaseId" = c."Id"
             AND a."Sequence" = (SELECT MAX(x."Sequence") FROM "Timeline" x WHERE x."ReviewCaseId" = c."Id")
        WHERE c."Id" = @case
        """;

    internal const string InsertEvidenceSql = """
        INSERT INTO "Evidence" ("ChecklistItemId", "Kind", "Text", "ContentSha256", "FileName", "ContentType", "SizeBytes", "Url", "AddedBy", "AddedByName", "AddedAt", "Role")
        VALUES (@item, @kind, @text, @sha, @file, @type, @size, @url, @by, @byName, @at, @role)
        RETURNING "Id"
        """;

    internal const string InsertTimelineSql = """
        INSERT INTO "Timeline" ("ReviewCaseId", "CandidateId", "Sequence", "At", "ActorId", "ActorName", "Kind", "ItemKey", "Text", "PreviousHash", "Hash", "Facts", "KeyId", "Mac")
        VALUES (@case, @candidate, @sequence, @at, @actor, @actorName, @kind, @key, @text, @previous, @hash, @facts, @keyId, @mac)
        """;

    internal const string UpdateItemSql = """
        UPDATE "ChecklistItems" SET "State" = @state, "Version" = "Version" + 1 WHERE "Id" = @item AND "Version" = @version
        """;

    internal const string UpdateCaseSql = """
        UPDATE "Cases" SET "State" = @state, "Version" = "Version" + 1, "UpdatedAt" = @at WHERE "Id" = @case AND "Version" = @version
        """;

    private const string EvidenceLinesSql = """
        SELECT "Kind", "ContentSha256", "AddedAt" FROM "Evidence" WHERE "ChecklistItemId" = @item ORDER BY "AddedAt", "Id"
        """;

    private const string ComputationLinesSql = """
        SELECT "Kind", "ParametersJson", "InputFingerprint", "ToolVersion", "ResultJson", "Verdict", "RunAt"
        FROM "Computations" WHERE "ChecklistItemId" = @item ORDER BY "RunAt", "Id"
        """;

    /// <summary>
    /// Adds the evidence <paramref name="make"/> builds (given the time of the change) to item <paramref name="itemKey"/>
    /// of case <paramref name="caseId"/>, or returns null, having stored nothing, when the item has current sign-offs.
    /// </summary>
    /// <exception cref="KeyNotFoundException">When the case or the item does not exist.</exception>
    /// <exception cref="DomainRuleException">When the case is closed.</exception>
    /// <exception cref="ArgumentException">When <paramref name="make"/> refuses the evidence.</exception>
    /// <exception cref="AppendConflictException">When the case changed under the append (only without the lock or writer).</exception>
    public static async Task<AppendedEvidence?> TryAppendAsync(SqlUnit unit, int caseId, string itemKey, Func<DateTimeOffset, EvidenceItem> make,
        Actor actor, DateTimeOffset now, CancellationToken ct)
    {
        ArgumentNullException.ThrowIfNull(unit);
        if (unit.Provider == DatabaseProvider.Postgres)
        {
            // Round trips, not statements, cost on a database server: the same plan in two (one with a remembered head).
            return await EvidenceAppendPostgres.TryAppendAsync(unit, caseId, itemKey, make, actor, now, ct);
        }

        var head = unit.Bound(HeadSql, ("@key", itemKey), ("@case", caseId));
        int itemId, itemVersion, caseVersion;
        EvidenceAppend.Head state;
        await using (var r = await head.ExecuteReaderAsync(ct))
        {
            if (!await r.ReadAsync(ct))
            {
                throw new KeyNotFoundException($"There is no case with id {caseId}.");
            }

            var candidate = r.GetString(1);
            if (r.IsDBNull(4))
            {
                throw new KeyNotFoundException($"Case {candidate} has no checklist item '{itemKey}'.");
            }

            caseVersion = r.GetInt32(3);
            itemId = r.GetInt32(4);
            itemVersion = r.GetInt32(6);
            state = new EvidenceAppend.Head(candidate, Enum.Parse<CaseState>(r.GetString(2)), itemKey, Enum.Parse<ItemState>(r.GetString(5)),
                r.IsDBNull(8) ? 0 : r.GetInt32(8), r.IsDBNull(9) ? TimelineEntry.GenesisHash : r.GetString(9), Convert.ToInt32(r.GetValue(7), System.Globalization.CultureInfo.InvariantCulture));
        }

        if (!EvidenceAppend.Covers(state) && state.CaseState != CaseState.Closed)
        {
            return null;
        }

        var evidence = make(now);
        var outcome = EvidenceAppend.Plan(state, evidence, actor, now);

        var insert = unit.Bound(InsertEvidenceSql, EvidenceValues(unit, itemId, evidence));
        var evidenceId = Convert.ToInt32(await insert.ExecuteScalarAsync(ct), System.Globalization.CultureInfo.InvariantCulture);

        var e = outcome.Entry;
        unit.Sign(e);
        var activity = unit.Bound(InsertTimelineSql, TimelineValues(unit, caseId, e));
        await activity.ExecuteNonQueryAsync(ct);

        var item = unit.Bound(UpdateItemSql,
            ("@state", outcome.ItemState.ToString()),
            ("@item", itemId),
            ("@version", itemVersion));
        var c = unit.Bound(UpdateCaseSql,
            ("@state", outcome.CaseState.ToString()),
            ("@at", unit.Time(now)),
            ("@case", caseId),
            ("@version", caseVersion));
        if (await item.ExecuteNonQueryAsync(ct) != 1 || await c.ExecuteNonQueryAsync(ct) != 1)
        {
            throw new AppendConflictException($"Case {state.CandidateId} changed while evidence was being added to '{itemKey}'.");
        }

        return new AppendedEvidence(evidenceId, evidence, outcome.ItemState, await FingerprintAsync(unit, itemId, ct));
    }

    /// <summary>Values of the evidence row's insert (<see cref="InsertEvidenceSql"/>).</summary>
    internal static (string Name, object? Value)[] EvidenceValues(SqlUnit unit, int itemId, EvidenceItem evidence) =>
    [
        ("@item", itemId),
        ("@kind", evidence.Kind.ToString()),
        ("@text", evidence.Text),
        ("@sha", evidence.ContentSha256),
        ("@file", evidence.FileName),
        ("@type", evidence.ContentType),
        ("@size", evidence.SizeBytes),
        ("@url", evidence.Url),
        ("@by", evidence.AddedBy),
        ("@byName", evidence.AddedByName),
        ("@at", unit.Time(evidence.AddedAt)),
        ("@role", evidence.Role),
    ];

    /// <summary>Values of the timeline entry's insert (<see cref="InsertTimelineSql"/>).</summary>
    internal static (string Name, object? Value)[] TimelineValues(SqlUnit unit, int caseId, TimelineEntry e) =>
    [
        ("@case", caseId),
        ("@candidate", e.CandidateId),
        ("@sequence", e.Sequence),
        ("@at", unit.Time(e.At)),
        ("@actor", e.ActorId),
        ("@actorName", e.ActorName),
        ("@kind", e.Kind),
        ("@key", e.ItemKey),
        ("@text", e.Text),
        ("@previous", e.PreviousHash),
        ("@hash", e.Hash),
        ("@facts", e.Facts),
        ("@keyId", e.KeyId),
        ("@mac", e.Mac),
    ];

    /// <summary>The item's evidence fingerprint as stored now (<see cref="EvidenceFingerprint"/>).</summary>
    public static async Task<string> FingerprintAsync(SqlUnit unit, int itemId, CancellationToken ct)
    {
        var evidence = new List<EvidenceLine>();
        var lines = unit.Bound(EvidenceLinesSql,
            ("@item", itemId));
        await using (var r = await lines.ExecuteReaderAsync(ct))
        {
            while (await r.ReadAsync(ct))
            {
                evidence.Add(new EvidenceLine(EvidenceFingerprint.KindName(Enum.Parse<EvidenceKind>(r.GetString(0))), r.GetString(1), unit.ReadTime(r, 2).UtcTicks));
            }
        }

        var computations = new List<ComputationLine>();
        var runs = unit.Bound(ComputationLinesSql,
            ("@item", itemId));
        await using (var r = await runs.ExecuteReaderAsync(ct))
        {
            while (await r.ReadAsync(ct))
            {
                var sha = ComputationRecord.ComputeContentSha256(r.GetString(0), r.GetString(1), r.GetString(2), r.GetString(3), r.GetString(4), r.GetString(5));
                computations.Add(new ComputationLine(sha, unit.ReadTime(r, 6).UtcTicks));
            }
        }

        return EvidenceFingerprint.Compute(evidence, computations);
    }
}

/// <summary>The case changed between reading it and storing an append; nothing was stored (try again).</summary>
public sealed class AppendConflictException(string message) : Exception(message);
