using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Evidence.Roles;
using EventReview.Data;
using EventReview.Data.Writes;
using EventReview.Web.Auth;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Services;

/// <summary>
/// Adding evidence to an item: notes, files (with their role) and links, all by one path. It follows the pure plan of
/// <see cref="EvidenceAppend"/>: the short path (<see cref="EvidenceAppendSql"/>, a few prepared statements, no case
/// loaded) first, and the loaded item through the aggregate only when the evidence makes current sign-offs stale.
/// </summary>
public sealed class EvidenceAppender(IDbContextFactory<AppDbContext> dbFactory, IWriteGate writes, CaseWriter writer, CaseQueries queries, AttachmentStore store, KnownItems known)
{
    /// <summary>Adds a note (see <see cref="AppendNoteAsync"/>) and returns the whole case as it is afterwards, for the pages.</summary>
    public async Task<ReviewCase> AddNoteAsync(ClaimsPrincipal user, int caseId, string itemKey, string markdown, CancellationToken ct = default)
    {
        await AppendNoteAsync(user, caseId, itemKey, markdown, ct);
        return await queries.GetAsync(user, caseId, ct);
    }

    /// <summary>
    /// Adds a note, loading at most the one item and the newest timeline entry, and returns a receipt instead of the
    /// whole case: the write path of the API, whose cost does not grow with the case.
    /// </summary>
    public Task<EvidenceReceipt> AppendNoteAsync(ClaimsPrincipal user, int caseId, string itemKey, string markdown, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.AddEvidence, "add evidence");
        var actor = user.ToActor();
        return AppendAsync(caseId, itemKey, now => EvidenceItem.Note(markdown, actor, now), actor, ct);
    }

    /// <summary>Adds a link (see <see cref="AppendLinkAsync"/>) and returns the whole case as it is afterwards, for the pages.</summary>
    public async Task<ReviewCase> AddLinkAsync(ClaimsPrincipal user, int caseId, string itemKey, string url, string title, CancellationToken ct = default)
    {
        await AppendLinkAsync(user, caseId, itemKey, url, title, ct);
        return await queries.GetAsync(user, caseId, ct);
    }

    /// <summary>Adds a link by the same path as a note (see <see cref="AppendNoteAsync"/>).</summary>
    public Task<EvidenceReceipt> AppendLinkAsync(ClaimsPrincipal user, int caseId, string itemKey, string url, string title, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.AddEvidence, "add evidence");
        var actor = user.ToActor();
        return AppendAsync(caseId, itemKey, now => EvidenceItem.Link(url, title, actor, now), actor, ct);
    }

    /// <summary>Stores a file content-addressed, attaches it to the item and returns the whole case afterwards, for the pages.</summary>
    /// <exception cref="AttachmentTooLargeException">When the file exceeds <paramref name="maxBytes"/>.</exception>
    public async Task<ReviewCase> AddAttachmentAsync(ClaimsPrincipal user, int caseId, string itemKey, Stream content, string fileName, string contentType,
        string description, long maxBytes, FileRole? role = null, CancellationToken ct = default)
    {
        await AppendAttachmentAsync(user, caseId, itemKey, content, fileName, contentType, description, maxBytes, role, ct);
        return await queries.GetAsync(user, caseId, ct);
    }

    /// <summary>
    /// Stores a file content-addressed and attaches it by the same path as a note (see <see cref="AppendNoteAsync"/>). The
    /// file keeps <paramref name="role"/> when given; otherwise its role is guessed from its first bytes and name
    /// (<see cref="FileRoleGuesser"/>) and the receipt says so.
    /// </summary>
    /// <exception cref="AttachmentTooLargeException">When the file exceeds <paramref name="maxBytes"/>.</exception>
    public async Task<EvidenceReceipt> AppendAttachmentAsync(ClaimsPrincipal user, int caseId, string itemKey, Stream content, string fileName, string contentType,
        string description, long maxBytes, FileRole? role = null, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.AddEvidence, "add evidence");
        EvidenceItem.CheckAttachmentFields(contentType, description);
        await EnsureItemExistsAsync(caseId, itemKey, ct);
        await EnsureNotClosedAsync(caseId, ct);
        var (sha, length) = await store.SaveAsync(content, maxBytes, ct);
        var guess = role is null ? await GuessRoleAsync(caseId, fileName, sha, ct) : null;
        var actor = user.ToActor();
        var receipt = await AppendAsync(caseId, itemKey, now => EvidenceItem.Attachment(fileName, contentType, length, sha, description, actor, now, role ?? guess!.Role), actor, ct);
        return receipt with { Role = role ?? guess!.Role, RoleGuess = guess?.Reason };
    }

    /// <summary>The role of a stored file guessed from its first bytes and name; the case's sites are read only for per-site roles.</summary>
    private async Task<FileRoleGuess> GuessRoleAsync(int caseId, string fileName, string sha, CancellationToken ct)
    {
        var head = new byte[FileRoleGuesser.HeadBytes];
        var read = 0;
        await using (var s = store.Open(sha))
        {
            while (s is not null && read < head.Length && await s.ReadAsync(head.AsMemory(read), ct) is var n and > 0)
            {
                read += n;
            }
        }

        var guess = FileRoleGuesser.Guess(fileName, head.AsSpan(0, read), []);
        if (!FileRole.IsPerSite(guess.Role.Kind))
        {
            return guess;
        }

        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var sites = await db.Cases.AsNoTracking().Where(c => c.Id == caseId).SelectMany(c => c.Arrivals.Select(a => a.SiteCode)).ToListAsync(ct);
        return FileRoleGuesser.Guess(fileName, head.AsSpan(0, read), sites);
    }

    /// <summary>
    /// Adds evidence by the short path (<see cref="EvidenceAppendSql"/>: a few prepared statements, no case loaded);
    /// when the item has current sign-offs, which the evidence makes stale, through the loaded item instead.
    /// </summary>
    private async Task<EvidenceReceipt> AppendAsync(int caseId, string itemKey, Func<DateTimeOffset, EvidenceItem> make, Actor actor, CancellationToken ct)
    {
        for (var attempt = 1; ; attempt++)
        {
            try
            {
                var stored = await writes.RunSqlAsync(
                    (unit, token) => EvidenceAppendSql.TryAppendAsync(unit, caseId, itemKey, make, actor, writer.Now(), token), ct);
                if (stored is null)
                {
                    break;
                }

                var e = stored.Evidence;
                return new EvidenceReceipt(stored.EvidenceId, e.ContentSha256, e.SizeBytes, e.FileName, stored.ItemState, stored.ItemFingerprint);
            }
            catch (AppendConflictException) when (attempt < CaseWriter.MaxAttempts)
            {
                await Task.Delay(Random.Shared.Next(1, 10) * attempt, ct);
            }
            catch (AppendConflictException)
            {
                throw new ConflictException(CaseWriter.BusyMessage);
            }
        }

        return await writer.WriteAsync((db, token) => PrepareAppendAsync(db, caseId, itemKey, make, actor, token), ct);
    }

    private async Task<Func<EvidenceReceipt>> PrepareAppendAsync(AppDbContext db, int caseId, string itemKey, Func<DateTimeOffset, EvidenceItem> make, Actor actor, CancellationToken ct)
    {
        // One connection for the five reads (the embedded driver's pool is a single lock shared by every request).
        await db.Database.OpenConnectionAsync(ct);
        var c = await db.LoadCaseWithOneItemAsync(caseId, itemKey, ct)
            ?? throw new KeyNotFoundException($"There is no case with id {caseId}.");
        await db.Database.CloseConnectionAsync();
        var now = writer.Now();
        var evidence = make(now);
        c.AddEvidence(itemKey, evidence, actor, now);
        return () =>
        {
            var item = c.Item(itemKey);
            return new EvidenceReceipt(evidence.Id, evidence.ContentSha256, evidence.SizeBytes, evidence.FileName, item.State, item.Fingerprint());
        };
    }

    // A refused upload must leave no file behind: a closed case refuses before the bytes are stored.
    private async Task EnsureNotClosedAsync(int caseId, CancellationToken ct)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var c = await db.Cases.AsNoTracking().Where(x => x.Id == caseId && x.State == CaseState.Closed).Select(x => x.CandidateId).FirstOrDefaultAsync(ct);
        if (c is not null)
        {
            throw ReviewCase.ClosedError(c);
        }
    }

    private async Task EnsureItemExistsAsync(int caseId, string itemKey, CancellationToken ct)
    {
        if (known.Contains(caseId, itemKey))
        {
            return;
        }

        await using var db = await dbFactory.CreateDbContextAsync(ct);
        if (await db.Items.AnyAsync(i => i.ReviewCaseId == caseId && i.Key == itemKey, ct))
        {
            known.Remember(caseId, [itemKey]);
            return;
        }

        throw await db.Cases.AnyAsync(c => c.Id == caseId, ct)
            ? new KeyNotFoundException($"Case {caseId} has no checklist item '{itemKey}'.")
            : new KeyNotFoundException($"There is no case with id {caseId}.");
    }
}
