using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Services;

/// <summary>
/// <see cref="CaseWorkflow.SignAsync"/> checks the signer's re-authentication itself, whoever calls it (page, single
/// sign-on flow, a future API): without a proof it accepts, it refuses with a message saying why and changes nothing.
/// </summary>
public sealed class CaseWorkflowSigningTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private static readonly ClaimsPrincipal Coordinator = Principals.Coordinator("u-coord-sign", "Coordinator Sage");
    private static readonly ClaimsPrincipal Owner = Principals.Reviewer("u-rev-sign-a", "Reviewer Arlo");
    private static readonly ClaimsPrincipal Signer = Principals.Reviewer("u-rev-sign-b", "Reviewer Bea");

    private const string SignerSubject = "provider-subject-bea";

    private T Get<T>() where T : notnull => app.Services.CreateScope().ServiceProvider.GetRequiredService<T>();

    private async Task<ReviewCase> ReadyItemAsync()
    {
        var gps = 1_400_000_000.125m;
        var request = new OpenCaseRequest(ApiCalls.NewCandidateId(), gps, "test-search", "Signing test.",
            [new ArrivalRequest("KP", gps + 0.004m, 9.5), new ArrivalRequest("AB", gps - 0.002m, 7.0)], "rapid-triage");
        var c = (await Get<CaseWorkflow>().OpenAsync(Coordinator, request)).Case;
        await Get<EvidenceAppender>().AddNoteAsync(Owner, c.Id, "triage.timing", "Delays checked.");
        return await Get<CaseWorkflow>().TransitionAsync(Owner, c.Id, "triage.timing", "ready", null);
    }

    public static TheoryData<string> BadProofs => ["wrong password", "empty password", "no proof", "provider: other person", "provider: stale sign-in", "provider: no auth_time"];

    private static SignatureProof? Proof(string kind, DateTimeOffset now) => kind switch
    {
        "wrong password" => new SignatureProof.Password("not-the-signers-password-1"),
        "empty password" => new SignatureProof.Password(string.Empty),
        "no proof" => null,
        "provider: other person" => new SignatureProof.ProviderSignIn("someone-else", now, now.AddSeconds(-5)),
        "provider: stale sign-in" => new SignatureProof.ProviderSignIn(SignerSubject, now.AddHours(-2), now.AddHours(-2)),
        _ => new SignatureProof.ProviderSignIn(SignerSubject, null, now),
    };

    [Theory]
    [MemberData(nameof(BadProofs))]
    public async Task Signing_without_a_valid_reauthentication_is_refused_by_the_service_and_changes_nothing(string kind)
    {
        var c = await ReadyItemAsync();
        await LinkSignerAsync(); // the signer has an account, a password and a single sign-on login of their own
        var before = await Get<CaseQueries>().GetAsync(Coordinator, c.Id);

        var ex = await Assert.ThrowsAsync<UnauthorizedAccessException>(() => Get<CaseWorkflow>().SignAsync(Signer, c.Id, "triage.timing",
            SignOffMeaning.Reviewed, "Checked.", c.Item("triage.timing").Fingerprint(), Proof(kind, app.Services.GetRequiredService<TimeProvider>().GetUtcNow())!));

        Assert.Contains("Nothing was signed", ex.Message, StringComparison.OrdinalIgnoreCase);
        var after = await Get<CaseQueries>().GetAsync(Coordinator, c.Id);
        Assert.Empty(after.Item("triage.timing").SignOffs);
        Assert.Equal(before.Timeline.Count, after.Timeline.Count);
        Assert.Equal(before.Item("triage.timing").Version, after.Item("triage.timing").Version);
    }

    [Fact]
    public async Task Signing_with_the_signers_own_password_or_a_fresh_provider_sign_in_signs()
    {
        var c = await ReadyItemAsync();
        await LinkSignerAsync();
        var signed = await Get<CaseWorkflow>().SignAsync(Signer, c.Id, "triage.timing", SignOffMeaning.Reviewed, "Checked.",
            c.Item("triage.timing").Fingerprint(), new SignatureProof.Password(Signers.Password));
        Assert.Single(signed.Item("triage.timing").SignOffs);

        var d = await ReadyItemAsync();
        var now = app.Services.GetRequiredService<TimeProvider>().GetUtcNow();
        var viaProvider = await Get<CaseWorkflow>().SignAsync(Signer, d.Id, "triage.timing", SignOffMeaning.Reviewed, "Checked.",
            d.Item("triage.timing").Fingerprint(), new SignatureProof.ProviderSignIn(SignerSubject, now.AddSeconds(-3), now.AddSeconds(-20)));
        Assert.Single(viaProvider.Item("triage.timing").SignOffs);
    }

    private async Task LinkSignerAsync()
    {
        await Signers.ProofAsync(app.Services, Signer);
        using var scope = app.Services.CreateScope();
        var users = scope.ServiceProvider.GetRequiredService<UserManager<AppUser>>();
        var account = (await users.FindByIdAsync(Signer.FindFirstValue(ClaimTypes.NameIdentifier)!))!;
        if ((await users.GetLoginsAsync(account)).Count == 0)
        {
            await users.AddLoginAsync(account, new UserLoginInfo(SingleSignOnAccounts.Provider, SignerSubject, "test provider"));
        }
    }
}
