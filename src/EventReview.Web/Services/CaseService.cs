using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Evidence.Roles;
using EventReview.Core.Time;
using EventReview.Data;
using EventReview.Data.Writes;
using EventReview.Web.Auth;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Services;

/// <summary>
/// Every read and change of cases, for the UI and the API alike. Roles are checked here on the server.
/// Changes load the case aggregate, apply one domain method and save; the case's version token serialises
/// concurrent changes, and append-only changes (evidence, notes) are retried so that nothing is lost.
/// </summary>
public sealed partial class CaseService(IDbContextFactory<AppDbContext> dbFactory, IWriteGate writes, TemplateCatalog templates, TimeProvider clock, AttachmentStore store, KnownItems known, ILogger<CaseService> log)
{
    private const int MaxAttempts = 6;

    /// <summary>One page of the cases, newest candidate first, optionally filtered by state and text.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When offset or limit is out of range (see <see cref="Paging"/>).</exception>
    public async Task<CaseListPage> ListAsync(ClaimsPrincipal user, CaseState? state = null, string? search = null, int? offset = null, int? limit = null, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        var (o, l) = Paging.Check(offset, limit);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        IQueryable<ReviewCase> q = db.Cases.AsNoTracking();
        if (state is not null)
        {
            q = q.Where(c => c.State == state);
        }

        if (!string.IsNullOrWhiteSpace(search))
        {
            var s = search.Trim().ToLower();
            q = q.Where(c => c.CandidateId.ToLower().Contains(s) || c.Summary.ToLower().Contains(s) || c.Search.ToLower().Contains(s));
        }

        var total = await q.CountAsync(ct);
        var page = await q.OrderByDescending(c => c.GpsNanoseconds).ThenByDescending(c => c.Id).Skip(o).Take(l)
            .Include(c => c.Arrivals)
            .Include(c => c.Items).ThenInclude(i => i.SignOffs)
            .AsSplitQuery()
            .ToListAsync(ct);
        return new CaseListPage(total, o, l, page);
    }

    /// <summary>A case with its items and sign-offs and per-item evidence counts and fingerprints, without evidence bodies or timeline.</summary>
    /// <exception cref="KeyNotFoundException">When there is no such case.</exception>
    public async Task<CaseOverview> GetOverviewAsync(ClaimsPrincipal user, int id, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var c = await db.Cases.AsNoTracking().Where(x => x.Id == id)
            .Include(x => x.Arrivals)
            .Include(x => x.Items).ThenInclude(i => i.SignOffs)
            .AsSplitQuery()
            .FirstOrDefaultAsync(ct)
            ?? throw new KeyNotFoundException($"There is no case with id {id}.");
        var evidence = await db.Evidence.AsNoTracking().Where(e => db.Items.Any(i => i.Id == e.ChecklistItemId && i.ReviewCaseId == id))
            .Select(e => new { e.Id, e.ChecklistItemId, e.Kind, e.ContentSha256, e.AddedAt })
            .ToListAsync(ct);
        var computations = await db.Computations.AsNoTracking().Where(r => db.Items.Any(i => i.Id == r.ChecklistItemId && i.ReviewCaseId == id))
            .Select(r => new { r.Id, r.ChecklistItemId, r.Kind, r.ParametersJson, r.InputFingerprint, r.ToolVersion, r.ResultJson, r.Verdict, r.RunAt })
            .ToListAsync(ct);
        var byItem = evidence.ToLookup(e => e.ChecklistItemId);
        var runsByItem = computations.ToLookup(r => r.ChecklistItemId);
        var summaries = c.Items.ToDictionary(i => i.Key, i =>
        {
            // Same canonical order as EvidenceFingerprint.Lines: time, then id.
            var lines = byItem[i.Id].OrderBy(e => e.AddedAt).ThenBy(e => e.Id)
                .Select(e => new EvidenceLine(EvidenceFingerprint.KindName(e.Kind), e.ContentSha256, e.AddedAt.UtcTicks)).ToList();
            var runs = runsByItem[i.Id].OrderBy(r => r.RunAt).ThenBy(r => r.Id)
                .Select(r => new ComputationLine(ComputationRecord.ComputeContentSha256(r.Kind, r.ParametersJson, r.InputFingerprint, r.ToolVersion, r.ResultJson, r.Verdict), r.RunAt.UtcTicks)).ToList();
            return new ItemEvidenceSummary(lines.Count, runs.Count, EvidenceFingerprint.Compute(lines, runs));
        });
        return new CaseOverview(c, summaries);
    }

    /// <summary>One page of an item's evidence, oldest first.</summary>
    /// <exception cref="KeyNotFoundException">When the case or item does not exist.</exception>
    public async Task<EvidencePage> EvidencePageAsync(ClaimsPrincipal user, int caseId, string itemKey, int? offset, int? limit, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        var (o, l) = Paging.Check(offset, limit);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var itemId = await ItemIdAsync(db, caseId, itemKey, ct);
        var q = db.Evidence.AsNoTracking().Where(e => e.ChecklistItemId == itemId);
        var total = await q.CountAsync(ct);
        var page = await q.OrderBy(e => e.Id).Skip(o).Take(l).ToListAsync(ct);
        return new EvidencePage(total, o, l, page);
    }

    /// <summary>One page of a case's timeline, newest first.</summary>
    /// <exception cref="KeyNotFoundException">When the case does not exist.</exception>
    public async Task<TimelinePage> TimelinePageAsync(ClaimsPrincipal user, int caseId, int? offset, int? limit, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        var (o, l) = Paging.Check(offset, limit);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        if (!await db.Cases.AnyAsync(c => c.Id == caseId, ct))
        {
            throw new KeyNotFoundException($"There is no case with id {caseId}.");
        }

        var q = db.Activity.AsNoTracking().Where(a => a.ReviewCaseId == caseId);
        var total = await q.CountAsync(ct);
        var page = await q.OrderByDescending(a => a.Sequence).Skip(o).Take(l).ToListAsync(ct);
        return new TimelinePage(total, o, l, page);
    }

    internal static async Task<int> ItemIdAsync(AppDbContext db, int caseId, string itemKey, CancellationToken ct)
    {
        var id = await db.Items.Where(i => i.ReviewCaseId == caseId && i.Key == itemKey).Select(i => (int?)i.Id).FirstOrDefaultAsync(ct);
        if (id is not null)
        {
            return id.Value;
        }

        throw await db.Cases.AnyAsync(c => c.Id == caseId, ct)
            ? new KeyNotFoundException($"Case {caseId} has no checklist item '{itemKey}'.")
            : new KeyNotFoundException($"There is no case with id {caseId}.");
    }

    /// <summary>One case with everything in it.</summary>
    /// <exception cref="KeyNotFoundException">When there is no such case.</exception>
    public async Task<ReviewCase> GetAsync(ClaimsPrincipal user, int id, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await db.CasesWithEverything().AsNoTracking().FirstOrDefaultAsync(c => c.Id == id, ct)
            ?? throw new KeyNotFoundException($"There is no case with id {id}.");
    }

    /// <summary>Opens a case, or returns the existing one with the same candidate id (created = false).</summary>
    /// <exception cref="ArgumentException">When a field is missing or invalid (message names it; nothing stored).</exception>
    public async Task<(ReviewCase Case, bool Created)> OpenAsync(ClaimsPrincipal user, OpenCaseRequest request, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.OpenCases, "open cases");
        var candidateId = EventReview.Core.Inputs.InputGuard.Identifier(request.CandidateId, EventReview.Core.Inputs.InputLimits.MaxCandidateIdLength, "candidateId");
        if (request.GpsTime is null)
        {
            throw new ArgumentException("gpsTime is required (GPS seconds).", "gpsTime");
        }

        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var template = templates.Find(string.IsNullOrWhiteSpace(request.Checklist) ? "candidate-review" : request.Checklist.Trim())
            ?? throw new ArgumentException($"checklist '{OpenCaseInput.Shown(request.Checklist)}' is not a known template (known: {string.Join(", ", templates.All.Select(t => t.Name))}).", "checklist");
        var network = await db.Networks.Include(n => n.Sites).AsNoTracking().FirstOrDefaultAsync(ct);
        var arrivals = OpenCaseInput.Arrivals(request.Arrivals, network);

        // The case is made (and every value checked) before anything is looked up or stored: an invalid request is
        // refused even when its candidate id already has a case.
        var c = ReviewCase.Open(candidateId, OpenCaseInput.Gps(request.GpsTime.Value, "gpsTime"), request.Search ?? string.Empty,
            request.Summary ?? string.Empty, arrivals, template, user.ToActor(), EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow()));
        var existing = await db.CasesWithEverything().AsNoTracking().FirstOrDefaultAsync(x => x.CandidateId == candidateId, ct);
        if (existing is not null)
        {
            return (existing, false);
        }

        try
        {
            db.Cases.Add(c);
            await writes.SaveAsync(db, ct);
            known.Remember(c.Id, c.Items.Select(i => i.Key));
            log.LogInformation("Case {CaseId} opened for candidate {CandidateId} by {Actor}", c.Id, c.CandidateId, c.CoordinatorName);
            return (c, true);
        }
        catch (DbUpdateException)
        {
            // Another request opened the same candidate at the same moment: return that one (idempotent).
            await using var again = await dbFactory.CreateDbContextAsync(ct);
            var winner = await again.CasesWithEverything().AsNoTracking().FirstOrDefaultAsync(x => x.CandidateId == c.CandidateId, ct);
            return winner is not null ? (winner, false) : throw new ConflictException("The case could not be stored; try again.");
        }
    }

    /// <summary>Adds a note (see <see cref="AppendNoteAsync"/>) and returns the whole case as it is afterwards, for the pages.</summary>
    public async Task<ReviewCase> AddNoteAsync(ClaimsPrincipal user, int caseId, string itemKey, string markdown, CancellationToken ct = default)
    {
        await AppendNoteAsync(user, caseId, itemKey, markdown, ct);
        return await GetAsync(user, caseId, ct);
    }

    /// <summary>
    /// Adds a note like <see cref="AddNoteAsync"/> but loads only the one item and the newest timeline entry, and
    /// returns a receipt instead of the whole case: the write path of the API, whose cost does not grow with the case.
    /// </summary>
    public Task<EvidenceReceipt> AppendNoteAsync(ClaimsPrincipal user, int caseId, string itemKey, string markdown, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.AddEvidence, "add evidence");
        var actor = user.ToActor();
        return AppendAsync(caseId, itemKey, now => EvidenceItem.Note(markdown, actor, now), actor, ct);
    }

    /// <summary>
    /// Stores a file content-addressed and attaches it, loading only the one item (see <see cref="AppendNoteAsync"/>). The file
    /// keeps <paramref name="role"/> when given; otherwise its role is guessed from its first bytes and name
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

    public Task<ReviewCase> AddLinkAsync(ClaimsPrincipal user, int caseId, string itemKey, string url, string title, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.AddEvidence, "add evidence");
        var actor = user.ToActor();
        return MutateAsync(caseId, itemKey, null, (c, now) => c.AddEvidence(itemKey, EvidenceItem.Link(url, title, actor, now), actor, now), ct);
    }

    /// <summary>Stores a file content-addressed, attaches it to the item and returns the whole case afterwards, for the pages.</summary>
    /// <exception cref="AttachmentTooLargeException">When the file exceeds <paramref name="maxBytes"/>.</exception>
    public async Task<ReviewCase> AddAttachmentAsync(ClaimsPrincipal user, int caseId, string itemKey, Stream content, string fileName, string contentType,
        string description, long maxBytes, FileRole? role = null, CancellationToken ct = default)
    {
        await AppendAttachmentAsync(user, caseId, itemKey, content, fileName, contentType, description, maxBytes, role, ct);
        return await GetAsync(user, caseId, ct);
    }

    /// <summary>Attaches a computation record made by a built-in check.</summary>
    public Task<ReviewCase> AddComputationAsync(ClaimsPrincipal user, int caseId, string itemKey, Func<DateTimeOffset, ComputationRecord> record, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "run checks");
        var actor = user.ToActor();
        return MutateAsync(caseId, itemKey, null, (c, now) => c.AddComputation(itemKey, record(now), actor, now), ct);
    }

    public Task<ReviewCase> AssignAsync(ClaimsPrincipal user, int caseId, string itemKey, string? ownerId, string? ownerName, int expectedVersion, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "assign items");
        var actor = user.ToActor();
        return MutateAsync(caseId, itemKey, expectedVersion, (c, now) => c.AssignItem(itemKey, ownerId, ownerName, actor, now), ct);
    }

    public Task<ReviewCase> SetDueAsync(ClaimsPrincipal user, int caseId, string itemKey, DateOnly? due, int expectedVersion, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "set due dates");
        var actor = user.ToActor();
        return MutateAsync(caseId, itemKey, expectedVersion, (c, now) => c.SetItemDue(itemKey, due, actor, now), ct);
    }

    /// <summary>Item transitions: "start", "ready" or "withdraw".</summary>
    public Task<ReviewCase> TransitionAsync(ClaimsPrincipal user, int caseId, string itemKey, string action, int? expectedVersion, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "change item states");
        var actor = user.ToActor();
        Action<ReviewCase, DateTimeOffset> change = action switch
        {
            "start" => (c, now) => c.StartItem(itemKey, actor, now),
            "ready" => (c, now) => c.MarkItemReady(itemKey, actor, now),
            "withdraw" => (c, now) => c.WithdrawItem(itemKey, actor, now),
            _ => throw new ArgumentException($"action '{action}' is not one of start, ready, withdraw.", nameof(action)),
        };
        return MutateAsync(caseId, itemKey, expectedVersion, change, ct);
    }

    /// <summary>Signs an item. The caller must have re-checked the signer's password.</summary>
    public Task<ReviewCase> SignAsync(ClaimsPrincipal user, int caseId, string itemKey, SignOffMeaning meaning, string statement, string seenFingerprint, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "sign items");
        var actor = user.ToActor();
        return MutateAsync(caseId, itemKey, null, (c, now) => c.SignItem(itemKey, actor, meaning, statement, seenFingerprint, now, GpsUtc.FromUtc(now.UtcDateTime)), ct);
    }

    public Task<ReviewCase> SubmitAsync(ClaimsPrincipal user, int caseId, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "submit cases for decision");
        var actor = user.ToActor();
        return MutateAsync(caseId, null, null, (c, now) => c.SubmitForDecision(actor, now), ct);
    }

    public Task<ReviewCase> ReturnAsync(ClaimsPrincipal user, int caseId, string reason, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "return cases to review");
        var actor = user.ToActor();
        return MutateAsync(caseId, null, null, (c, now) => c.ReturnToReview(reason, actor, now), ct);
    }

    public Task<ReviewCase> CloseAsync(ClaimsPrincipal user, int caseId, CaseOutcome outcome, string statement, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "close cases");
        var actor = user.ToActor();
        return MutateCoreAsync(caseId, null, null, async (db, c, now) =>
        {
            await Checks.SealedRecordService.EnsureMayCloseAsync(db, c, outcome, ct);
            c.Close(outcome, statement, actor, now);
        }, ct);
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

    /// <summary>
    /// Attaches a computation record made inside the same database transaction as other changes (e.g. freezing a
    /// configuration record): <paramref name="make"/> gets the context and the time, may change other tracked entities,
    /// and returns the record and, when it froze one, the configuration record (which the timeline entry then records).
    /// Everything is saved together or not at all.
    /// </summary>
    public Task<ReviewCase> AddComputationWithAsync(ClaimsPrincipal user, string policy, int caseId, string itemKey,
        Func<AppDbContext, ReviewCase, DateTimeOffset, Task<(ComputationRecord Record, Core.Configuration.ConfigurationSnapshot? Frozen)>> make, CancellationToken ct = default)
    {
        Permissions.Require(user, policy, "do this");
        var actor = user.ToActor();
        return MutateCoreAsync(caseId, itemKey, null, async (db, c, now) =>
        {
            var (record, frozen) = await make(db, c, now);
            c.AddComputation(itemKey, record, actor, now, frozen);
        }, ct);
    }

    private Task<ReviewCase> MutateAsync(int caseId, string? itemKey, int? expectedItemVersion, Action<ReviewCase, DateTimeOffset> change, CancellationToken ct) =>
        MutateCoreAsync(caseId, itemKey, expectedItemVersion, (_, c, now) =>
        {
            change(c, now);
            return Task.CompletedTask;
        }, ct);

    /// <summary>
    /// Adds evidence by the short path (<see cref="EvidenceAppendSql"/>: a few prepared statements, no case loaded);
    /// when the item has current sign-offs, which the evidence makes stale, through the whole case instead.
    /// </summary>
    private async Task<EvidenceReceipt> AppendAsync(int caseId, string itemKey, Func<DateTimeOffset, EvidenceItem> make, Actor actor, CancellationToken ct)
    {
        for (var attempt = 1; ; attempt++)
        {
            try
            {
                var stored = await writes.RunSqlAsync(
                    (unit, token) => EvidenceAppendSql.TryAppendAsync(unit, caseId, itemKey, make, actor, EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow()), token), ct);
                if (stored is null)
                {
                    break;
                }

                var e = stored.Evidence;
                return new EvidenceReceipt(stored.EvidenceId, e.ContentSha256, e.SizeBytes, e.FileName, stored.ItemState, stored.ItemFingerprint);
            }
            catch (AppendConflictException) when (attempt < MaxAttempts)
            {
                await Task.Delay(Random.Shared.Next(1, 10) * attempt, ct);
            }
            catch (AppendConflictException)
            {
                throw new ConflictException("The case is being changed by others right now and your change could not be saved; nothing was applied. Try again.");
            }
        }

        return await WriteAsync((db, token) => PrepareAppendAsync(db, caseId, itemKey, make, actor, token), ct);
    }

    /// <summary>
    /// One change, never lost to a race: first optimistically (read in parallel with others, then queue the save);
    /// after a conflict (someone changed the case between the read and the save), read-change-save again with no
    /// writer in between. <paramref name="prepare"/> reads and changes, and returns what to answer once saved.
    /// </summary>
    private async Task<T> WriteAsync<T>(Func<AppDbContext, CancellationToken, Task<Func<T>>> prepare, CancellationToken ct)
    {
        for (var attempt = 1; ; attempt++)
        {
            try
            {
                if (attempt == 1)
                {
                    await using var db = await dbFactory.CreateDbContextAsync(ct);
                    var answer = await prepare(db, ct);
                    await writes.SaveAsync(db, ct);
                    return answer();
                }

                return await writes.RunAsync(async (db, token) =>
                {
                    var answer = await prepare(db, token);
                    await db.SaveChangesAsync(token);
                    return answer();
                }, ct);
            }
            catch (DbUpdateException) when (attempt < MaxAttempts)
            {
                await Task.Delay(Random.Shared.Next(1, 10) * attempt, ct);
            }
            catch (DbUpdateException)
            {
                throw new ConflictException("The case is being changed by others right now and your change could not be saved; nothing was applied. Try again.");
            }
        }
    }

    private async Task<Func<EvidenceReceipt>> PrepareAppendAsync(AppDbContext db, int caseId, string itemKey, Func<DateTimeOffset, EvidenceItem> make, Actor actor, CancellationToken ct)
    {
        // One connection for the five reads (the embedded driver's pool is a single lock shared by every request).
        await db.Database.OpenConnectionAsync(ct);
        var c = await db.LoadCaseWithOneItemAsync(caseId, itemKey, ct)
            ?? throw new KeyNotFoundException($"There is no case with id {caseId}.");
        await db.Database.CloseConnectionAsync();
        var now = EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow());
        var evidence = make(now);
        c.AddEvidence(itemKey, evidence, actor, now);
        return () =>
        {
            var item = c.Item(itemKey);
            return new EvidenceReceipt(evidence.Id, evidence.ContentSha256, evidence.SizeBytes, evidence.FileName, item.State, item.Fingerprint());
        };
    }

    private Task<ReviewCase> MutateCoreAsync(int caseId, string? itemKey, int? expectedItemVersion, Func<AppDbContext, ReviewCase, DateTimeOffset, Task> change, CancellationToken ct) =>
        WriteAsync<ReviewCase>(async (db, token) =>
        {
            var c = await PrepareMutationAsync(db, caseId, itemKey, expectedItemVersion, change, token);
            return () => c;
        }, ct);

    private async Task<ReviewCase> PrepareMutationAsync(AppDbContext db, int caseId, string? itemKey, int? expectedItemVersion,
        Func<AppDbContext, ReviewCase, DateTimeOffset, Task> change, CancellationToken ct)
    {
        var c = await db.CasesWithEverything().FirstOrDefaultAsync(x => x.Id == caseId, ct)
            ?? throw new KeyNotFoundException($"There is no case with id {caseId}.");
        if (itemKey is not null)
        {
            var item = c.Item(itemKey);
            if (expectedItemVersion is not null && item.Version != expectedItemVersion)
            {
                var last = c.Activity.Where(a => a.ItemKey == itemKey).MaxBy(a => a.Sequence);
                throw new ConflictException($"Item '{itemKey}' was changed by {last?.ActorName ?? "someone else"} while you were editing it ({last?.Text}). Your change was not applied; the item has been reloaded — check it and apply your change again.");
            }
        }

        await change(db, c, EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow()));
        return c;
    }
}
