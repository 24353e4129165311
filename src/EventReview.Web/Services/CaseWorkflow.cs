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
/// The case workflow: opening a case, item assignment, due dates, state transitions, sign-offs (with the signer's
/// re-authentication checked here), computation records (and the freezing and sealing that go with them), submission,
/// return and closing. Every change goes through one domain method, saved by <see cref="CaseWriter"/> and retried on a
/// version conflict; roles are checked here on the server.
/// </summary>
public sealed class CaseWorkflow(IDbContextFactory<AppDbContext> dbFactory, IWriteGate writes, CaseWriter writer, SignerCheck signers, TemplateCatalog templates, KnownItems known, ILogger<CaseWorkflow> log)
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
            request.Summary ?? string.Empty, arrivals, template, user.ToActor(), writer.Now());
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
        return writer.MutateAsync(caseId, itemKey, expectedVersion, (c, now) => c.AssignItem(itemKey, ownerId, ownerName, actor, now), ct);
    }

    public Task<ReviewCase> SetDueAsync(ClaimsPrincipal user, int caseId, string itemKey, DateOnly? due, int expectedVersion, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "set due dates");
        var actor = user.ToActor();
        return writer.MutateAsync(caseId, itemKey, expectedVersion, (c, now) => c.SetItemDue(itemKey, due, actor, now), ct);
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
        return writer.MutateAsync(caseId, itemKey, expectedVersion, change, ct);
    }

    /// <summary>
    /// Signs an item after checking the signer's re-authentication itself (<see cref="SignerCheck"/>): the page or
    /// the sign-in flow only passes <paramref name="proof"/> on.
    /// </summary>
    /// <exception cref="UnauthorizedAccessException">When the person may not sign, or <paramref name="proof"/> does not prove them now (nothing is changed).</exception>
    public async Task<ReviewCase> SignAsync(ClaimsPrincipal user, int caseId, string itemKey, SignOffMeaning meaning, string statement, string seenFingerprint,
        SignatureProof proof, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "sign items");
        if (await signers.ProblemAsync(user, proof) is { } problem)
        {
            log.LogWarning("Sign-off of case {CaseId} item {ItemKey} refused: the signer's re-authentication failed", caseId, itemKey);
            throw new UnauthorizedAccessException(problem);
        }

        var actor = user.ToActor();
        return await writer.MutateAsync(caseId, itemKey, null, (c, now) => c.SignItem(itemKey, actor, meaning, statement, seenFingerprint, now, GpsUtc.FromUtc(now.UtcDateTime)), ct);
    }

    /// <summary>Attaches a computation record made by a built-in check (current sign-offs of the item become stale).</summary>
    public Task<ReviewCase> AddComputationAsync(ClaimsPrincipal user, int caseId, string itemKey, Func<DateTimeOffset, ComputationRecord> record, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "run checks");
        var actor = user.ToActor();
        return writer.MutateAsync(caseId, itemKey, null, (c, now) => c.AddComputation(itemKey, record(now), actor, now), ct);
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
        return writer.MutateAsync(caseId, itemKey, null, async (db, c, now) =>
        {
            var (record, frozen) = await make(db, c, now);
            c.AddComputation(itemKey, record, actor, now, frozen);
        }, ct);
    }

    public Task<ReviewCase> SubmitAsync(ClaimsPrincipal user, int caseId, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "submit cases for decision");
        var actor = user.ToActor();
        return writer.MutateAsync(caseId, null, null, (c, now) => c.SubmitForDecision(actor, now), ct);
    }

    public Task<ReviewCase> ReturnAsync(ClaimsPrincipal user, int caseId, string reason, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "return cases to review");
        var actor = user.ToActor();
        return writer.MutateAsync(caseId, null, null, (c, now) => c.ReturnToReview(reason, actor, now), ct);
    }

    public Task<ReviewCase> CloseAsync(ClaimsPrincipal user, int caseId, CaseOutcome outcome, string statement, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "close cases");
        var actor = user.ToActor();
        return writer.MutateAsync(caseId, null, null, async (db, c, now) =>
        {
            await Checks.SealedRecordService.EnsureMayCloseAsync(db, c, outcome, ct);
            c.Close(outcome, statement, actor, now);
        }, ct);
    }
}
