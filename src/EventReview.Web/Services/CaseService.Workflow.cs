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

/// <summary> The case workflow: opening a case, item assignment, due dates, state transitions, sign-offs, submission, return and closing; every change through one domain method, saved by the writer and retried on a version conflict. </summary>
public sealed partial class CaseService
{
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

    private Task<ReviewCase> MutateAsync(int caseId, string? itemKey, int? expectedItemVersion, Action<ReviewCase, DateTimeOffset> change, CancellationToken ct) =>
        MutateCoreAsync(caseId, itemKey, expectedItemVersion, (_, c, now) =>
        {
            change(c, now);
            return Task.CompletedTask;
        }, ct);

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
