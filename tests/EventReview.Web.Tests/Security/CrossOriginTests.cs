using System.Net;
using EventReview.Web.Security;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Security;

/// <summary>
/// The sign-in cookie is SameSite=Lax, and "same site" ignores the port: a page on the same host under another port
/// makes the browser send it. Cookie-authenticated writes therefore need the app's own origin or its antiforgery token;
/// API tokens, which a browser never adds on its own, are not affected.
/// </summary>
public sealed class CrossOriginTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private async Task<(int CaseId, int EvidenceCount)> StateAsync()
    {
        var id = await (await app.As(Who.Observer)).CaseIdAsync("ER-C-0157");
        await using var db = app.Db();
        return (id, await db.Evidence.CountAsync());
    }

    private static HttpRequestMessage Note(int caseId, string? origin, string text = "cross-origin attempt")
    {
        var request = new HttpRequestMessage(HttpMethod.Post, $"/api/cases/{caseId}/items/triage.state/notes") { Content = ApiCalls.Json($"{{\"text\": \"{text}\"}}") };
        request.Headers.Remove("Origin");
        if (origin is not null)
        {
            request.Headers.Add("Origin", origin);
        }

        return request;
    }

    [Theory]
    [InlineData("http://localhost:8081")]
    [InlineData("https://localhost")]
    [InlineData("http://evil.example")]
    [InlineData("null")]
    public async Task A_cookie_write_from_another_origin_is_refused_as_a_403_problem_and_stores_nothing(string origin)
    {
        var (caseId, before) = await StateAsync();
        var reviewer = await app.As(Who.Reviewer);

        using var response = await reviewer.SendAsync(Note(caseId, origin));

        Assert.Equal(HttpStatusCode.Forbidden, response.StatusCode);
        var problem = await response.JsonAsync();
        Assert.Equal(CrossSiteRequestGuard.Rule, (string?)problem["rule"]);
        Assert.Contains("another origin", (string?)problem["detail"], StringComparison.Ordinal);
        Assert.Equal(before, (await StateAsync()).EvidenceCount);
    }

    [Fact]
    public async Task A_cookie_write_from_the_apps_own_origin_is_accepted()
    {
        var (caseId, before) = await StateAsync();

        using var response = await (await app.As(Who.Reviewer)).SendAsync(Note(caseId, EventReviewFactory.OwnOrigin, "same-origin note"));

        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        Assert.Equal(before + 1, (await StateAsync()).EvidenceCount);
    }

    [Fact]
    public async Task A_cookie_write_without_an_origin_needs_the_antiforgery_token_of_the_apps_pages()
    {
        var (caseId, before) = await StateAsync();
        var client = await app.SignedInClientAsync(EventReviewFactory.AccountFor(Who.Reviewer));
        client.DefaultRequestHeaders.Remove("Origin");

        using var bare = await client.SendAsync(Note(caseId, null));
        Assert.Equal(HttpStatusCode.Forbidden, bare.StatusCode);
        Assert.Contains("antiforgery token", (string?)(await bare.JsonAsync())["detail"], StringComparison.Ordinal);
        Assert.Equal(before, (await StateAsync()).EvidenceCount);

        // The token of a page the signed-in user opened (the client keeps the matching cookie).
        var token = EventReviewFactory.AntiforgeryTokenIn(await client.GetStringAsync("/cases"))
            ?? throw new InvalidOperationException("the cases page has no antiforgery token");
        using var withToken = Note(caseId, null, "note with the page's token");
        withToken.Headers.Add("RequestVerificationToken", token);
        using var accepted = await client.SendAsync(withToken);

        Assert.Equal(HttpStatusCode.Created, accepted.StatusCode);
        Assert.Equal(before + 1, (await StateAsync()).EvidenceCount);
    }

    [Fact]
    public async Task A_token_write_is_not_judged_by_its_origin()
    {
        var (caseId, before) = await StateAsync();

        using var response = await (await app.As(Who.Token)).SendAsync(Note(caseId, "http://localhost:8081", "pipeline note"));

        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        Assert.Equal(before + 1, (await StateAsync()).EvidenceCount);
    }

    [Fact]
    public async Task Reads_with_the_cookie_from_another_origin_are_answered()
    {
        var reviewer = await app.As(Who.Reviewer);
        using var request = new HttpRequestMessage(HttpMethod.Get, "/api/cases");
        request.Headers.Add("Origin", "http://localhost:8081");

        using var response = await reviewer.SendAsync(request);

        // A browser does not let the other origin read the answer (no CORS headers); a GET changes nothing.
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.False(response.Headers.Contains("Access-Control-Allow-Origin"));
    }

    [Fact]
    public async Task A_sign_in_post_from_another_origin_is_refused_before_the_password_is_checked()
    {
        var client = app.Anonymous();
        var token = await EventReviewFactory.AntiforgeryTokenAsync(client);
        var account = EventReviewFactory.AccountFor(Who.Observer);
        using var request = new HttpRequestMessage(HttpMethod.Post, "/account/signin")
        {
            Content = new FormUrlEncodedContent(new Dictionary<string, string>
            {
                ["__RequestVerificationToken"] = token, ["email"] = account.Email, ["password"] = account.Password, ["returnUrl"] = "/cases",
            }),
        };
        request.Headers.Add("Origin", "http://localhost:8081");
        await using var db = app.Db();
        var audited = await db.AccountEvents.CountAsync();

        using var response = await client.SendAsync(request);

        Assert.Equal(HttpStatusCode.Forbidden, response.StatusCode);
        Assert.Equal(audited, await db.AccountEvents.CountAsync());
    }
}
