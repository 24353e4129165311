using System.Net;
using EventReview.Core.Evidence;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Auth;

/// <summary>
/// Single sign-on against an OpenID Connect provider started in this process (<see cref="TestIdentityProvider"/>):
/// the first sign-in makes the account, roles follow the provider's groups at every sign-in and each change is in the
/// sign-in audit, and signing a review item needs a fresh sign-in at the provider.
/// </summary>
public sealed class SingleSignOnTests(SingleSignOnFactory app) : IClassFixture<SingleSignOnFactory>
{
    private static string Unique(string name) => $"{name}-{Guid.NewGuid():N}"[..(name.Length + 9)];

    private ProviderPerson Person(params string[] groups)
    {
        var user = Unique("p");
        return app.Provider.Add(user, $"{user}@collab.example.org", $"Person {user}", groups);
    }

    private async Task<AppUser> AccountAsync(string email)
    {
        await using var db = app.Db();
        return await db.Users.AsNoTracking().SingleAsync(u => u.Email == email);
    }

    private async Task<string?> RoleAsync(AppUser user)
    {
        using var scope = app.Services.CreateScope();
        var users = scope.ServiceProvider.GetRequiredService<UserManager<AppUser>>();
        return (await users.GetRolesAsync(user)).SingleOrDefault();
    }

    private async Task<List<AccountEvent>> AuditAsync(string userId)
    {
        await using var db = app.Db();
        return await db.AccountEvents.AsNoTracking().Where(e => e.UserId == userId).OrderBy(e => e.Sequence).ToListAsync();
    }

    [Fact]
    public async Task The_sign_in_page_explains_both_ways_in()
    {
        var html = await app.Anonymous().GetStringAsync("/signin");

        Assert.Contains("With your collaboration account", html, StringComparison.Ordinal);
        Assert.Contains($"Sign in with {SingleSignOnFactory.ProviderName}", html, StringComparison.Ordinal);
        Assert.Contains("comes from your groups there", html, StringComparison.Ordinal);
        Assert.Contains("With a local account", html, StringComparison.Ordinal);
        Assert.Contains("name=\"password\"", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_first_sign_in_makes_the_account_with_the_role_its_group_maps_to_and_audits_it()
    {
        var person = Person("gw-review-coordinators", "unrelated-group");
        using var browser = new SsoBrowser(app, app.Provider);

        var landed = await browser.SignInAsync(person, "/team");

        Assert.Equal(HttpStatusCode.OK, landed.StatusCode);
        Assert.Equal("/team", browser.Location.AbsolutePath); // a coordinator page opens
        var account = await AccountAsync(person.Email);
        Assert.Equal(person.Name, account.DisplayName);
        Assert.Equal(Roles.Coordinator, await RoleAsync(account));
        var audit = await AuditAsync(account.Id);
        Assert.Equal([AccountEventKinds.AccountCreated, AccountEventKinds.SignInSucceeded], audit.Select(e => e.Kind));
        Assert.Contains("groups [gw-review-coordinators]", audit[0].Detail, StringComparison.Ordinal);
        Assert.Equal("single sign-on", audit[1].Detail);
    }

    [Fact]
    public async Task Roles_follow_the_provider_groups_at_every_sign_in_and_each_change_is_audited()
    {
        var person = Person("gw-members");
        using (var first = new SsoBrowser(app, app.Provider))
        {
            await first.SignInAsync(person);
        }

        var account = await AccountAsync(person.Email);
        Assert.Equal(Roles.Observer, await RoleAsync(account));

        // Promoted at the provider: the next sign-in makes them a reviewer (the highest role of their groups).
        app.Provider.People[person.UserName] = person with { Groups = ["gw-members", "gw-instrument-checks"] };
        using (var second = new SsoBrowser(app, app.Provider))
        {
            await second.SignInAsync(person);
        }

        Assert.Equal(Roles.Reviewer, await RoleAsync(account));
        var change = (await AuditAsync(account.Id)).Single(e => e.Kind == AccountEventKinds.RoleChanged);
        Assert.Equal("observer -> reviewer: groups [gw-instrument-checks]", change.Detail);

        // The account and its new role are accounted for by the signed sign-in audit: whole-record verification holds.
        var (_, database) = await app.Services.GetRequiredService<EventReview.Data.IntegrityVerifier>().VerifyAsync();
        Assert.DoesNotContain(database, p => p.What.Contains(person.Email, StringComparison.OrdinalIgnoreCase) || p.What.Contains(account.Id, StringComparison.Ordinal));
        Assert.Empty(database);

        // Removed from every review group: refused, with a page that says why, and the refusal is audited.
        app.Provider.People[person.UserName] = person with { Groups = ["somewhere-else"] };
        using var third = new SsoBrowser(app, app.Provider);
        var page = await third.SignInAsync(person);
        Assert.Equal("sso-no-role", third.ErrorCode);
        Assert.Contains("none of the groups that give a role", await page.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.Equal(HttpStatusCode.Redirect, (await third.App.GetAsync("/cases")).StatusCode); // not signed in
        Assert.Contains(await AuditAsync(account.Id), e => e.Kind == AccountEventKinds.SignInFailed && e.Detail.Contains("somewhere-else", StringComparison.Ordinal));
    }

    [Fact]
    public async Task An_existing_local_account_is_joined_only_when_the_provider_vouches_for_the_email()
    {
        using (var scope = app.Services.CreateScope())
        {
            await scope.ServiceProvider.GetRequiredService<AccountAdmin>().CreateUserAsync("early.bird@collab.example.org", Roles.Reviewer, null, "Early Bird");
            await scope.ServiceProvider.GetRequiredService<AccountAdmin>().CreateUserAsync("unverified@collab.example.org", Roles.Reviewer, null, "Not Verified");
        }

        var verified = app.Provider.Add(Unique("early"), "early.bird@collab.example.org", "Early Bird", "gw-reviewers");
        using (var browser = new SsoBrowser(app, app.Provider))
        {
            await browser.SignInAsync(verified);
            Assert.Equal("/cases", browser.Location.AbsolutePath);
        }

        var local = await AccountAsync("early.bird@collab.example.org");
        Assert.Contains(await AuditAsync(local.Id), e => e.Kind == AccountEventKinds.AccountLinked);

        var unverified = app.Provider.Add(Unique("unver"), "unverified@collab.example.org", "Not Verified", "gw-reviewers") with { EmailVerified = false };
        app.Provider.People[unverified.UserName] = unverified;
        using var other = new SsoBrowser(app, app.Provider);
        await other.SignInAsync(unverified);
        Assert.Equal("sso-email-taken", other.ErrorCode);
        await using var db = app.Db();
        Assert.Equal(1, await db.Users.CountAsync(u => u.Email == "unverified@collab.example.org"));
        Assert.False(await db.UserLogins.AnyAsync(l => l.ProviderKey == unverified.Subject));
    }

    [Fact]
    public async Task Signing_asks_the_provider_for_a_fresh_sign_in_and_then_signs()
    {
        var (browser, signer, item) = await SignerWithReadyItemAsync();
        using (browser)
        {
            var loginsBefore = app.Provider.Logins;
            var id = await BeginAsync(signer, item);

            await browser.GoAsync($"/account/sso/sign/{id}");
            Assert.True(browser.AtProviderLogin, "the provider must ask for the credentials again (prompt=login)");
            await browser.LogInAtProviderAsync(signer.Person);

            Assert.Equal(loginsBefore + 1, app.Provider.Logins);
            Assert.Equal($"/cases/{item.CaseId}/items/{item.Key}", browser.Location.AbsolutePath);
            var request = await RequestAsync(id);
            Assert.True(request.Signed, request.Outcome);
            var c = await Get<CaseQueries>().GetAsync(Principals.Coordinator("t", "t"), item.CaseId);
            var signOff = Assert.Single(c.Item(item.Key).SignOffs);
            Assert.Equal((signer.Account.Id, "Checked at the provider."), (signOff.UserId, signOff.Statement));
            Assert.Contains(await AuditAsync(signer.Account.Id), e => e.Kind == AccountEventKinds.SignatureReauthenticated);
        }
    }

    [Fact]
    public async Task A_provider_that_reuses_an_old_session_instead_of_asking_again_gets_no_signature()
    {
        // The naive check ("the provider answered for the right person") would sign here; auth_time shows it was not fresh.
        app.Provider.ClockOffset = TimeSpan.FromMinutes(-30);
        var (browser, signer, item) = await SignerWithReadyItemAsync();
        app.Provider.ClockOffset = TimeSpan.Zero;
        using (browser)
        {
            app.Provider.IgnoreLoginPrompt = true;
            try
            {
                var id = await BeginAsync(signer, item);
                await browser.GoAsync($"/account/sso/sign/{id}");

                Assert.False(browser.AtProviderLogin);
                var request = await RequestAsync(id);
                Assert.False(request.Signed);
                Assert.Contains("did not ask for your credentials again", request.Outcome, StringComparison.Ordinal);
                var c = await Get<CaseQueries>().GetAsync(Principals.Coordinator("t", "t"), item.CaseId);
                Assert.Empty(c.Item(item.Key).SignOffs);
                Assert.Contains(await AuditAsync(signer.Account.Id), e => e.Kind == AccountEventKinds.SignatureRefused);

                // The request is used up: coming back to it signs nothing.
                await browser.GoAsync($"/account/sso/sign/{id}");
                Assert.Empty((await Get<CaseQueries>().GetAsync(Principals.Coordinator("t", "t"), item.CaseId)).Item(item.Key).SignOffs);
            }
            finally
            {
                app.Provider.IgnoreLoginPrompt = false;
            }
        }
    }

    [Fact]
    public async Task Another_person_signing_in_at_the_provider_cannot_sign_for_the_signer()
    {
        var (browser, signer, item) = await SignerWithReadyItemAsync();
        var intruder = Person("gw-reviewers");
        using (browser)
        {
            var id = await BeginAsync(signer, item);
            await browser.GoAsync($"/account/sso/sign/{id}");
            await browser.LogInAtProviderAsync(intruder);

            var request = await RequestAsync(id);
            Assert.False(request.Signed);
            Assert.Contains("different person", request.Outcome, StringComparison.Ordinal);
            Assert.Empty((await Get<CaseQueries>().GetAsync(Principals.Coordinator("t", "t"), item.CaseId)).Item(item.Key).SignOffs);
        }
    }

    [Fact]
    public async Task A_signature_request_belongs_to_its_signer()
    {
        var (browser, signer, item) = await SignerWithReadyItemAsync();
        var (other, _, _) = await SignerWithReadyItemAsync();
        using (browser)
        using (other)
        {
            var id = await BeginAsync(signer, item);
            await other.GoAsync($"/account/sso/sign/{id}");

            Assert.Equal("/cases", other.Location.AbsolutePath);
            Assert.Null((await RequestAsync(id)).UsedAt);
        }
    }

    private T Get<T>() where T : notnull => app.Services.CreateScope().ServiceProvider.GetRequiredService<T>();

    private async Task<SignatureRequest> RequestAsync(string id)
    {
        await using var db = app.Db();
        return await db.SignatureRequests.AsNoTracking().SingleAsync(r => r.Id == id);
    }

    private async Task<string> BeginAsync(Signer signer, (int CaseId, string Key, string Fingerprint) item) =>
        await Get<ReauthenticatedSigning>().BeginAsync(Principals.Reviewer(signer.Account.Id, signer.Account.DisplayName), item.CaseId, item.Key,
            SignOffMeaning.Reviewed, "Checked at the provider.", item.Fingerprint);

    private sealed record Signer(ProviderPerson Person, AppUser Account);

    /// <summary>A reviewer signed in by single sign-on, and an item of a new case ready for their sign-off (owned by someone else).</summary>
    private async Task<(SsoBrowser Browser, Signer Signer, (int CaseId, string Key, string Fingerprint) Item)> SignerWithReadyItemAsync()
    {
        var person = Person("gw-reviewers");
        var browser = new SsoBrowser(app, app.Provider);
        await browser.SignInAsync(person);
        var account = await AccountAsync(person.Email);

        var coordinator = Principals.Coordinator("u-coord-sso", "Coordinator Sso");
        var owner = Principals.Reviewer("u-owner-sso", "Owner Sso");
        var appender = Get<EvidenceAppender>();
        var workflow = Get<CaseWorkflow>();
        var gps = 1_400_000_000.125m;
        var opened = (await workflow.OpenAsync(coordinator, new OpenCaseRequest(ApiCalls.NewCandidateId(), gps, "test-search", "SSO signing.",
            [new ArrivalRequest("KP", gps + 0.004m, 9.5), new ArrivalRequest("AB", gps - 0.002m, 7.0)], "rapid-triage"))).Case;
        await appender.AddNoteAsync(owner, opened.Id, "triage.timing", "Timing looks consistent.");
        var c = await workflow.TransitionAsync(owner, opened.Id, "triage.timing", "ready", null);
        return (browser, new Signer(person, account), (c.Id, "triage.timing", c.Item("triage.timing").Fingerprint()));
    }
}
