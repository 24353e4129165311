using System.Net;
using EventReview.Data.Auth;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Security;

/// <summary>Lockout, password rules, the sign-in audit, cookie flags and forged form posts.</summary>
public sealed class SignInHardeningTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private async Task<(string Email, string Password)> NewAccountAsync(string role = Roles.Observer)
    {
        var email = $"person-{Guid.NewGuid():N}"[..20] + "@demo.invalid";
        using var scope = app.Services.CreateScope();
        var (_, password, _) = await scope.ServiceProvider.GetRequiredService<AccountAdmin>().CreateUserAsync(email, role, null, null);
        return (email, password);
    }

    [Fact]
    public async Task Five_wrong_passwords_lock_the_account_even_against_the_right_password_and_the_page_says_so()
    {
        var (email, password) = await NewAccountAsync();
        var client = app.Anonymous();
        var answers = new List<string>();
        for (var i = 0; i < 5; i++)
        {
            using var wrong = await EventReviewFactory.PostSignInAsync(client, email, "Wrong-password-" + i);
            answers.Add(wrong.Headers.Location!.OriginalString);
        }

        using var right = await EventReviewFactory.PostSignInAsync(client, email, password);

        Assert.All(answers.Take(4), a => Assert.StartsWith("/signin?error=invalid", a, StringComparison.Ordinal));
        Assert.StartsWith("/signin?error=locked", answers[4], StringComparison.Ordinal);
        Assert.StartsWith("/signin?error=locked", right.Headers.Location!.OriginalString, StringComparison.Ordinal);
        var page = await client.GetStringAsync("/signin?error=locked");
        Assert.Contains("locked after too many failed sign-in attempts. Try again in 15 minutes", page, StringComparison.Ordinal);
        await using var db = app.Db();
        Assert.Equal(4, await db.AccountEvents.CountAsync(e => e.Account == email && e.Kind == AccountEventKinds.SignInFailed));
        Assert.Equal(2, await db.AccountEvents.CountAsync(e => e.Account == email && e.Kind == AccountEventKinds.LockedOut));
    }

    [Fact]
    public async Task A_wrong_password_and_an_unknown_email_get_the_same_answer()
    {
        var (email, _) = await NewAccountAsync();

        using var known = await EventReviewFactory.PostSignInAsync(app.Anonymous(), email, "Not-the-password-1");
        using var unknown = await EventReviewFactory.PostSignInAsync(app.Anonymous(), "nobody-" + email, "Not-the-password-1");

        Assert.Equal(known.StatusCode, unknown.StatusCode);
        Assert.Equal(known.Headers.Location, unknown.Headers.Location);
    }

    [Fact]
    public async Task Sign_in_and_sign_out_are_recorded_with_address_and_account_and_never_the_password()
    {
        var (email, password) = await NewAccountAsync();
        var client = app.Anonymous();
        using (var typo = await EventReviewFactory.PostSignInAsync(client, email, password + "x"))
        using (var ok = await EventReviewFactory.PostSignInAsync(client, email, password))
        {
            Assert.Equal("/cases", ok.Headers.Location?.OriginalString);
        }

        using (var signOut = await client.PostAsync("/account/signout", new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["__RequestVerificationToken"] = await EventReviewFactory.AntiforgeryTokenAsync(client, "/cases"),
        })))
        {
            Assert.Equal(HttpStatusCode.Redirect, signOut.StatusCode);
        }

        await using var db = app.Db();
        var user = await db.Users.SingleAsync(u => u.Email == email);
        var events = await db.AccountEvents.Where(e => e.Account == email && e.Kind != AccountEventKinds.AccountCreated).OrderBy(e => e.Sequence).ToListAsync();
        Assert.Equal([AccountEventKinds.SignInFailed, AccountEventKinds.SignInSucceeded, AccountEventKinds.SignedOut], events.Select(e => e.Kind));
        Assert.Single(await db.AccountEvents.Where(e => e.Account == email && e.Kind == AccountEventKinds.AccountCreated).ToListAsync());
        Assert.All(events, e => Assert.Equal(user.Id, e.UserId));
        Assert.All(events, e => Assert.Equal("unknown", e.Address)); // the in-memory test server has no remote address
        Assert.False(await db.AccountEvents.AnyAsync(e => e.Detail.Contains(password) || e.Account.Contains(password)));
        using var scope = app.Services.CreateScope();
        Assert.Null(await scope.ServiceProvider.GetRequiredService<AccountAudit>().FirstProblemAsync());
    }

    [Fact]
    public async Task Creating_and_revoking_a_token_is_recorded_without_its_secret()
    {
        using var scope = app.Services.CreateScope();
        var admin = scope.ServiceProvider.GetRequiredService<AccountAdmin>();
        var name = "audited " + Guid.NewGuid().ToString("N")[..6];

        var (token, secret) = await admin.CreateTokenAsync(name, "Coordinator Test", [TokenScopes.CasesRead], 7);
        await admin.RevokeTokenAsync(token.Id, "Coordinator Test");

        await using var db = app.Db();
        var events = await db.AccountEvents.Where(e => e.Detail.Contains(name)).OrderBy(e => e.Sequence).ToListAsync();
        Assert.Equal([AccountEventKinds.TokenCreated, AccountEventKinds.TokenRevoked], events.Select(e => e.Kind));
        Assert.Contains("scopes [cases:read]", events[0].Detail, StringComparison.Ordinal);
        Assert.All(events, e => Assert.DoesNotContain(secret, e.Detail, StringComparison.Ordinal));
        var part = secret[4..20];
        Assert.False(await db.AccountEvents.AnyAsync(e => e.Detail.Contains(part)));
    }

    [Theory]
    [InlineData("Short1abc", "at least 12 characters")]
    [InlineData("Password1234", "very common")]
    [InlineData("Qwertyuiop123", "very common")]
    public async Task A_weak_password_is_refused_with_a_clear_reason(string password, string reason)
    {
        using var scope = app.Services.CreateScope();
        var admin = scope.ServiceProvider.GetRequiredService<AccountAdmin>();

        var ex = await Assert.ThrowsAsync<ArgumentException>(() => admin.CreateUserAsync($"weak-{Guid.NewGuid():N}"[..16] + "@demo.invalid", Roles.Observer, password, null));

        Assert.Contains(reason, ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_password_equal_to_the_email_is_refused()
    {
        using var scope = app.Services.CreateScope();
        var email = $"Same{Guid.NewGuid():N}"[..14] + "@Demo.invalid";

        var ex = await Assert.ThrowsAsync<ArgumentException>(() =>
            scope.ServiceProvider.GetRequiredService<AccountAdmin>().CreateUserAsync(email, Roles.Observer, email, null));

        Assert.Contains("must not be the email address", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_auth_cookie_is_http_only_and_same_site_lax()
    {
        var (email, password) = await NewAccountAsync();

        using var ok = await EventReviewFactory.PostSignInAsync(app.Anonymous(), email, password);

        var cookie = ok.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("eventreview.auth=", StringComparison.Ordinal));
        Assert.Contains("httponly", cookie, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("samesite=lax", cookie, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public async Task A_cross_site_sign_out_without_the_antiforgery_token_is_refused_and_the_session_survives()
    {
        var (email, password) = await NewAccountAsync();
        var client = app.Anonymous();
        using (await EventReviewFactory.PostSignInAsync(client, email, password))
        {
        }

        using var forged = await client.PostAsync("/account/signout", new FormUrlEncodedContent(new Dictionary<string, string>()));

        Assert.Equal(HttpStatusCode.BadRequest, forged.StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/cases")).StatusCode);
        await using var db = app.Db();
        Assert.False(await db.AccountEvents.AnyAsync(e => e.Account == email && e.Kind == AccountEventKinds.SignedOut));
    }

    [Fact]
    public async Task A_cross_site_sign_in_post_with_a_forged_token_changes_nothing()
    {
        var (email, password) = await NewAccountAsync();

        using var forged = await app.Anonymous().PostAsync("/account/signin", new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["__RequestVerificationToken"] = "CfDJ8forged",
            ["email"] = email,
            ["password"] = password,
        }));

        Assert.Equal(HttpStatusCode.BadRequest, forged.StatusCode);
        Assert.False(forged.Headers.TryGetValues("Set-Cookie", out var cookies) && cookies.Any(c => c.StartsWith("eventreview.auth=", StringComparison.Ordinal)));
        await using var db = app.Db();
        Assert.False(await db.AccountEvents.AnyAsync(e => e.Account == email && e.Kind != AccountEventKinds.AccountCreated));
    }

    [Fact]
    public async Task Coordinators_see_sign_in_activity_on_the_team_page_newest_first()
    {
        var (email, password) = await NewAccountAsync();
        using (await EventReviewFactory.PostSignInAsync(app.Anonymous(), email, "Wrong-password-9"))
        using (await EventReviewFactory.PostSignInAsync(app.Anonymous(), email, password))
        {
        }

        var html = await (await app.As(Who.Coordinator)).GetStringAsync("/team");

        Assert.Contains("Sign-in activity", html, StringComparison.Ordinal);
        Assert.Contains("the chain verifies", html, StringComparison.Ordinal);
        var who = System.Text.RegularExpressions.Regex.Escape(email);
        var succeeded = System.Text.RegularExpressions.Regex.Match(html, "<td>signed in</td>\\s*<td>" + who);
        var failed = System.Text.RegularExpressions.Regex.Match(html, "<td>sign-in failed</td>\\s*<td>" + who);
        Assert.True(succeeded.Success && failed.Success && failed.Index > succeeded.Index, "newest entry first");
    }

    [Fact]
    public async Task The_tokens_page_shows_scopes_expiry_and_expired_tokens_as_expired()
    {
        await app.As(Who.TokenExpired);
        await app.As(Who.TokenPipeline);

        var html = await (await app.As(Who.Coordinator)).GetStringAsync("/tokens");

        Assert.Matches("test token \\(expired\\)</td>\\s*<td>cases:read, cases:open, evidence:add</td>[\\s\\S]*?<td>expired</td>", html);
        Assert.Matches("test token \\(pipeline\\)</td>\\s*<td>cases:open, evidence:add</td>[\\s\\S]*?<td>active \\(90 days left\\)</td>", html);
    }
}
