using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Injections;
using EventReview.Core.Verdicts;
using EventReview.Data;
using EventReview.Web.Auth;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Sealed blind-injection records: coordinators register a commitment (the tool never sees the record), the case shows
/// that an unopened seal exists, a case cannot be closed as astrophysical while one is unopened or an opened one holds a
/// blind injection at the candidate (the rule is Core's <see cref="BlindInjectionClosing"/>), and at the end a
/// coordinator opens it with the record and the salt: on a match the seal is marked opened and a computation record
/// (kind "injections") with the blind injections overlapping the case goes on the item and its timeline. Registering
/// and opening each commit together with a sign-in audit entry whose facts record the seal's state, so that a seal
/// marked opened (or un-opened, or given another commitment) by hand is caught by verification.
/// </summary>
public sealed class SealedRecordService(IDbContextFactory<AppDbContext> dbFactory, CaseQueries cases, EvidenceAppender appender, CaseWorkflow workflow, TimeProvider clock, Data.Auth.AccountAudit audit)
{
    /// <summary>The message shown when opening fails; nothing is changed.</summary>
    public const string MismatchMessage = "The record or salt does not match the commitment; nothing was opened.";

    /// <summary>Every seal, newest first.</summary>
    public async Task<IReadOnlyList<SealedInjectionRecord>> ListAsync(CancellationToken ct = default)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return (await db.SealedInjectionRecords.AsNoTracking().ToListAsync(ct)).OrderByDescending(s => s.SealedAt).ThenByDescending(s => s.Id).ToList();
    }

    /// <summary>True while any registered seal is not opened.</summary>
    public async Task<bool> AnyUnopenedAsync(CancellationToken ct = default)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await db.SealedInjectionRecords.AnyAsync(s => s.OpenedAt == null, ct);
    }

    /// <summary>
    /// What the sealed records say about closing <paramref name="c"/> with <paramref name="outcome"/> (Core's
    /// <see cref="BlindInjectionClosing"/>: every seal opened, and no opened record with a blind injection at the candidate).
    /// </summary>
    public async Task<ClosingDecision> DecideClosingAsync(ReviewCase c, CaseOutcome outcome, CancellationToken ct = default)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await DecideClosingAsync(db, c, outcome, ct);
    }

    /// <summary>Refuses to close <paramref name="c"/> with <paramref name="outcome"/> when the sealed records stand in the way.</summary>
    /// <exception cref="DomainRuleException">Rule "sealed-record-unopened" or "blind-injection-overlap".</exception>
    public async Task EnsureMayCloseAsync(ReviewCase c, CaseOutcome outcome, CancellationToken ct = default)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        await EnsureMayCloseAsync(db, c, outcome, ct);
    }

    /// <summary>Same rule, inside an existing unit of work (used by <see cref="CaseWorkflow.CloseAsync"/>).</summary>
    /// <exception cref="DomainRuleException">Rule "sealed-record-unopened" or "blind-injection-overlap".</exception>
    public static async Task EnsureMayCloseAsync(AppDbContext db, ReviewCase c, CaseOutcome outcome, CancellationToken ct = default)
    {
        var decision = await DecideClosingAsync(db, c, outcome, ct);
        if (!decision.Allowed)
        {
            throw new DomainRuleException(decision.Rule!, decision.Judgement.Reason);
        }
    }

    private static async Task<ClosingDecision> DecideClosingAsync(AppDbContext db, ReviewCase c, CaseOutcome outcome, CancellationToken ct)
    {
        if (outcome != CaseOutcome.Astrophysical)
        {
            return BlindInjectionClosing.Decide(outcome, []);
        }

        var seals = await db.SealedInjectionRecords.AsNoTracking().Select(s => new { s.Label, s.OpenedRecord }).ToListAsync(ct);
        var arrivals = InjectionCheckService.Arrivals(c);
        return BlindInjectionClosing.Decide(outcome, [.. seals.Select(s => BlindInjectionClosing.StateOf(s.Label, s.OpenedRecord, c.Gps, arrivals))]);
    }

    /// <summary>Registers a seal (coordinators). When <paramref name="caseId"/> and <paramref name="itemKey"/> are given, a note
    /// with the commitment is added to that item so the case records it.</summary>
    /// <exception cref="ArgumentException">Commitment not 64 hex digits, empty label, or the commitment is already registered.</exception>
    public async Task<SealedInjectionRecord> RegisterAsync(ClaimsPrincipal user, string commitment, string label, int? caseId = null, string? itemKey = null, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "register sealed records");
        var actor = user.ToActor();
        var seal = SealedInjectionRecord.Register(commitment, label, actor, EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow()));
        await using (var db = await dbFactory.CreateDbContextAsync(ct))
        {
            if (await db.SealedInjectionRecords.AnyAsync(s => s.Commitment == seal.Commitment, ct))
            {
                throw new ArgumentException("This commitment is already registered.", nameof(commitment));
            }

            await using var held = await audit.HoldAsync(ct);
            await using var tx = await db.Database.BeginTransactionAsync(ct);
            db.SealedInjectionRecords.Add(seal);
            await db.SaveChangesAsync(ct);
            await audit.RecordInAsync(db, Data.Auth.AccountEventKinds.SealRegistered, actor.UserId, actor.DisplayName, null,
                $"sealed record {seal.Id} '{seal.Label}'", Data.Auth.AuditFacts.Seal(seal), ct);
            await tx.CommitAsync(ct);
        }

        if (caseId is { } id && itemKey is not null)
        {
            await appender.AddNoteAsync(user, id, itemKey,
                $"Sealed blind-injection record registered: **{seal.Label}**, commitment `{seal.Commitment}` (SHA-256 of salt + record), by {seal.SealedByName} at {seal.SealedAt:u}. The tool holds only the commitment until the record is opened.", ct);
        }

        return seal;
    }

    /// <summary>
    /// Opens a seal with the record bytes and salt (coordinators). On a match: marks the seal opened and stores a computation
    /// record (kind "injections") on the item with the blind injections overlapping the case; the timeline entry is written
    /// with it. On a mismatch nothing changes.
    /// </summary>
    /// <remarks>
    /// The record is opened only when every item of the required sections is signed (<see cref="SealedRecordOpening"/>);
    /// before that only with <paramref name="overrideReason"/>, a coordinator's written reason that goes into the timeline
    /// with the comparison.
    /// </remarks>
    /// <exception cref="DomainRuleException">"sections-unsigned", "commitment-mismatch" (message <see cref="MismatchMessage"/>) or "seal-already-opened".</exception>
    /// <exception cref="FormatException">The record matches but does not parse (names the line); nothing is stored.</exception>
    public async Task<ReviewCase> OpenAsync(ClaimsPrincipal user, int sealId, int caseId, string itemKey, byte[] record, string saltHex, double marginSeconds = 10.0,
        string? overrideReason = null, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "open sealed records");
        ArgumentNullException.ThrowIfNull(record);
        new InjectionCheckParameters(null, marginSeconds).Validate();
        var c = await cases.GetAsync(user, caseId, ct);
        var opening = SealedRecordOpening.Decide(c, itemKey, overrideReason);
        if (!opening.Allowed)
        {
            throw new DomainRuleException(OpeningDecision.Rule, opening.Reason);
        }

        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var seal = await db.SealedInjectionRecords.FirstOrDefaultAsync(s => s.Id == sealId, ct) ?? throw new KeyNotFoundException($"There is no sealed record {sealId}.");
        if (seal.IsOpened)
        {
            throw new DomainRuleException("seal-already-opened", $"The sealed record '{seal.Label}' was already opened by {seal.OpenedByName} at {seal.OpenedAt:u}; compare with the opened record instead.");
        }

        InjectionOverlapReport? report;
        try
        {
            report = BlindInjectionRecord.Open(seal.Commitment, record, saltHex ?? string.Empty, c.Gps, InjectionCheckService.Arrivals(c), c.Arrivals.Select(a => a.SiteCode), marginSeconds);
        }
        catch (FormatException ex) when (ex is not Core.Imports.CsvFormatException)
        {
            report = null; // the salt is not hex: same answer as a wrong salt
        }
        catch (Core.Imports.CsvFormatException ex)
        {
            throw new FormatException($"The record matches its commitment but does not parse as an injection log: {ex.Message}. Nothing was opened.", ex);
        }

        if (report is null)
        {
            throw new DomainRuleException("commitment-mismatch", MismatchMessage);
        }

        var rows = BlindInjectionRecord.Parse(record, null).Count;
        var summary = InjectionCheckService.Summarise(report, rows, $"sealed record '{seal.Label}'");
        var actor = user.ToActor();
        seal.Open(record, saltHex!, caseId, Clip($"{c.CandidateId}: {summary}", 1000), actor, EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow()));
        try
        {
            await using var held = await audit.HoldAsync(ct);
            await using var tx = await db.Database.BeginTransactionAsync(ct);
            await db.SaveChangesAsync(ct);
            await audit.RecordInAsync(db, Data.Auth.AccountEventKinds.SealOpened, actor.UserId, actor.DisplayName, null,
                $"sealed record {seal.Id} '{seal.Label}' opened in {c.CandidateId}", Data.Auth.AuditFacts.Seal(seal), ct);
            await tx.CommitAsync(ct);
        }
        catch (DbUpdateConcurrencyException)
        {
            throw new ConflictException("Someone else opened this sealed record at the same moment; reload to see their result.");
        }

        return await AddComparisonAsync(user, seal, c, itemKey, report, rows, marginSeconds, opening.Overridden ? overrideReason!.Trim() : null, ct);
    }

    /// <summary>Compares a case with an already opened record (its revealed bytes are kept), storing a computation record.</summary>
    /// <exception cref="InvalidOperationException">When the seal is not opened yet.</exception>
    public async Task<ReviewCase> CompareWithOpenedAsync(ClaimsPrincipal user, int sealId, int caseId, string itemKey, double marginSeconds = 10.0, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "run checks");
        new InjectionCheckParameters(null, marginSeconds).Validate();
        var c = await cases.GetAsync(user, caseId, ct);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var seal = await db.SealedInjectionRecords.AsNoTracking().FirstOrDefaultAsync(s => s.Id == sealId, ct) ?? throw new KeyNotFoundException($"There is no sealed record {sealId}.");
        if (seal.OpenedRecord is not { } bytes)
        {
            throw new InvalidOperationException($"The sealed record '{seal.Label}' is not opened yet.");
        }

        var report = InjectionOverlap.Find(BlindInjectionRecord.Parse(bytes, null), c.Gps, InjectionCheckService.Arrivals(c), c.Arrivals.Select(a => a.SiteCode), marginSeconds);
        return await AddComparisonAsync(user, seal, c, itemKey, report, BlindInjectionRecord.Parse(bytes, null).Count, marginSeconds, null, ct);
    }

    private async Task<ReviewCase> AddComparisonAsync(ClaimsPrincipal user, SealedInjectionRecord seal, ReviewCase c, string itemKey, InjectionOverlapReport report, int rows, double margin,
        string? overrideReason, CancellationToken ct)
    {
        var info = new SealInfo(seal.Id, seal.Label, seal.Commitment, Hashing.Sha256Hex(seal.OpenedRecord!), seal.SealedByName, seal.SealedAt, seal.OpenedByName!, seal.OpenedAt!.Value);
        var result = new InjectionRecordResult(RecordFormat.Current, "sealed-record", report, rows, [], info);
        var parametersJson = CheckRecords.Serialize(new { sealId = seal.Id, commitment = seal.Commitment, marginSeconds = margin });
        var fingerprint = CheckRecords.Fingerprint(new
        {
            caseGps = c.GpsNanoseconds,
            arrivals = c.Arrivals.OrderBy(a => a.SiteCode).Select(a => new { a.SiteCode, a.ArrivalNanoseconds }),
            record = info.RecordSha256,
        });
        var summary = $"Sealed record '{seal.Label}' opened and verified against its commitment {seal.Commitment[..12]}…: " +
                      InjectionCheckService.Summarise(report, rows, "record");
        var record = (DateTimeOffset now) => new ComputationRecord(CheckKind.Injections, parametersJson, fingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(result),
            report.Judgement.Word, Clip(summary, 1000), string.Empty, user.ToActor(), now);
        if (overrideReason is null)
        {
            return await workflow.AddComputationAsync(user, c.Id, itemKey, record, ct);
        }

        // The override and the comparison are stored together: the timeline says why the record was opened early.
        return await workflow.AddComputationWithAsync(user, Policies.Coordinate, c.Id, itemKey, (_, loaded, now) =>
        {
            loaded.RecordOverride(itemKey, OpeningDecision.Rule, $"sealed record '{seal.Label}' opened before the review was complete. Reason: {overrideReason}", user.ToActor(), now);
            return Task.FromResult<(ComputationRecord, EventReview.Core.Configuration.ConfigurationSnapshot?)>((record(now), null));
        }, ct);
    }

    private static string Clip(string s, int max) => s.Length <= max ? s : s[..(max - 1)] + "…";
}
