using System.Globalization;
using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Data;
using EventReview.Data.Auth;
using EventReview.Data.Writes;
using EventReview.Web.Services;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;
using EventReview.Core.Inputs;

namespace EventReview.Web.Auth;

/// <summary>
/// Signing a review item with a single sign-on account: instead of a password, the signer proves who they are at
/// the identity provider at the moment of signing. <see cref="BeginAsync"/> keeps what is being signed (a
/// <see cref="SignatureRequest"/>); the browser goes to the provider with <c>prompt=login</c> and <c>max_age=0</c>;
/// <see cref="CompleteAsync"/> signs only if the provider's answer names the same person and its <c>auth_time</c> is
/// fresh (<see cref="SignerCheck"/>, checked by <see cref="CaseWorkflow.SignAsync"/>). Both outcomes go into the sign-in audit.
/// </summary>
public sealed class ReauthenticatedSigning(
    IDbContextFactory<AppDbContext> dbFactory,
    IWriteGate writes,
    CaseWorkflow workflow,
    AccountAudit audit,
    TimeProvider clock,
    IOptions<SignInSettings> options)
{
    /// <summary>Keeps a sign-off to be made after re-authentication; returns the request's id.</summary>
    /// <exception cref="UnauthorizedAccessException">When the person may not sign.</exception>
    /// <exception cref="DomainRuleException">When the statement is empty (nothing is kept).</exception>
    public async Task<string> BeginAsync(ClaimsPrincipal user, int caseId, string itemKey, SignOffMeaning meaning, string statement, string seenFingerprint, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "sign items");
        if (string.IsNullOrWhiteSpace(statement))
        {
            throw new DomainRuleException("statement-required", "A sign-off needs a statement saying what was checked.");
        }

        var request = SignatureRequest.Create(user.ToActor().UserId, caseId, itemKey, meaning, statement.Trim(), seenFingerprint, clock.GetUtcNow());
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        db.SignatureRequests.Add(request);
        await writes.SaveAsync(db, ct);
        return request.Id;
    }

    /// <summary>The request with this id made by <paramref name="user"/>, or null when there is none.</summary>
    public async Task<SignatureRequest?> FindAsync(ClaimsPrincipal user, string id, CancellationToken ct = default)
    {
        var userId = user.FindFirstValue(ClaimTypes.NameIdentifier);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await db.SignatureRequests.AsNoTracking().FirstOrDefaultAsync(r => r.Id == id && r.UserId == userId, ct);
    }

    /// <summary>
    /// Ends the request <paramref name="id"/> of <paramref name="user"/>: signs when <paramref name="reauthenticated"/>
    /// (the provider's fresh answer) proves the same person recently enough, otherwise records why not. Returns the
    /// request as it ended, or null when <paramref name="user"/> has no such request.
    /// </summary>
    /// <param name="failure">Why the provider gave no answer (the person cancelled, the provider failed), or null.</param>
    public async Task<SignatureRequest?> CompleteAsync(ClaimsPrincipal user, string id, ClaimsPrincipal? reauthenticated, string? failure, string? address, CancellationToken ct = default)
    {
        var request = await FindAsync(user, id, ct);
        if (request is null || request.UsedAt is not null)
        {
            return request;
        }

        var now = clock.GetUtcNow();
        var problem = failure ?? Problem(request, reauthenticated, now);
        var signed = false;
        if (problem is null)
        {
            try
            {
                // The workflow checks that the answer names this signer's account and is fresh (SignerCheck).
                var proof = new SignatureProof.ProviderSignIn(reauthenticated!.FindFirstValue("sub"), AuthTime(reauthenticated), request.CreatedAt);
                await workflow.SignAsync(user, request.CaseId, request.ItemKey, request.Meaning, request.Statement, request.SeenFingerprint, proof, ct);
                signed = true;
            }
            catch (Exception ex) when (ex is DomainRuleException or ConflictException or UnauthorizedAccessException or KeyNotFoundException)
            {
                problem = UserMessage.From(ex);
            }
        }

        var account = user.Identity?.Name;
        var where = $"case {request.CaseId} item '{request.ItemKey}'";
        await audit.RecordAsync(signed ? AccountEventKinds.SignatureReauthenticated : AccountEventKinds.SignatureRefused, request.UserId, account, address,
            signed ? $"{where}: provider sign-in at {AuthTime(reauthenticated):yyyy-MM-dd HH:mm:ss} UTC" : $"{where}: {problem}",
            ct: CancellationToken.None); // the audit line of a sign-in already done is written even when the request is cancelled
        var outcome = signed
            ? $"Signed after you signed in again at {options.Value.SingleSignOn.DisplayName} ({AuthTime(reauthenticated):HH:mm:ss} UTC)."
            : problem!;
        return await writes.RunAsync(async (db, token) =>
        {
            var row = await db.SignatureRequests.FirstAsync(r => r.Id == id, token);
            row.Use(now, signed, outcome);
            await db.SaveChangesAsync(token);
            return row;
        }, ct);
    }

    /// <summary>Why the request cannot be signed at all (expired, no answer), or null; the answer itself is judged by <see cref="SignerCheck"/>.</summary>
    private static string? Problem(SignatureRequest request, ClaimsPrincipal? reauthenticated, DateTimeOffset now)
    {
        if (!request.IsOpen(now))
        {
            return $"The request to sign expired ({SignatureRequest.Lifetime.TotalMinutes:0} minutes) before you came back from the identity provider. Nothing was signed; sign again.";
        }

        return reauthenticated is null ? "The identity provider gave no answer. Nothing was signed; try again." : null;
    }

    /// <summary>The provider's <c>auth_time</c> claim (Unix seconds), or null.</summary>
    public static DateTimeOffset? AuthTime(ClaimsPrincipal? principal) =>
        long.TryParse(principal?.FindFirstValue("auth_time"), NumberStyles.None, CultureInfo.InvariantCulture, out var seconds)
            ? DateTimeOffset.FromUnixTimeSeconds(seconds)
            : null;
}
