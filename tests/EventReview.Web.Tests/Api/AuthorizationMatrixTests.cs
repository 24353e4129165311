using System.Net;
using EventReview.Data.Auth;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Api;

/// <summary>Every API endpoint against every kind of caller; roles are checked on the server.</summary>
public sealed class AuthorizationMatrixTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    public static TheoryData<string, string, int> Matrix()
    {
        var data = new TheoryData<string, string, int>();
        void Row(string endpoint, int anonymous, int observer, int reviewer, int coordinator, int token)
        {
            data.Add(endpoint, Who.Anonymous, anonymous);
            data.Add(endpoint, Who.Observer, observer);
            data.Add(endpoint, Who.Reviewer, reviewer);
            data.Add(endpoint, Who.Coordinator, coordinator);
            data.Add(endpoint, Who.Token, token);
        }

        Row("POST /api/cases", 401, 403, 403, 201, 201);
        Row("GET /api/cases", 401, 200, 200, 200, 200);
        Row("GET /api/cases/{id}", 401, 200, 200, 200, 200);
        Row("GET /api/sites", 401, 200, 200, 200, 200);
        Row("POST /api/cases/{id}/items/{key}/notes", 401, 403, 201, 201, 201);
        Row("POST /api/cases/{id}/items/{key}/attachments", 401, 403, 201, 201, 201);
        Row("GET /openapi/v1.json", 401, 200, 200, 200, 200);
        return data;
    }

    [Theory]
    [MemberData(nameof(Matrix))]
    public async Task Each_endpoint_answers_each_caller_with_the_expected_status(string endpoint, string who, int expected)
    {
        var client = await app.As(who);
        var caseId = await (await app.As(Who.Coordinator)).CaseIdAsync("ER-C-0142");

        using var response = endpoint switch
        {
            "POST /api/cases" => await client.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId())),
            "GET /api/cases" => await client.GetAsync("/api/cases"),
            "GET /api/cases/{id}" => await client.GetAsync($"/api/cases/{caseId}"),
            "GET /api/sites" => await client.GetAsync("/api/sites"),
            "POST /api/cases/{id}/items/{key}/notes" => await client.AddNoteAsync(caseId, "timing.arrival", $"Note by {who}."),
            "POST /api/cases/{id}/items/{key}/attachments" => await client.AttachAsync(caseId, "timing.arrival", System.Text.Encoding.UTF8.GetBytes($"file by {who}")),
            "GET /openapi/v1.json" => await client.GetAsync("/openapi/v1.json"),
            _ => throw new ArgumentOutOfRangeException(nameof(endpoint), endpoint, "no such row"),
        };

        Assert.Equal(expected, (int)response.StatusCode);
        if (expected is 401 or 403)
        {
            Assert.Null(response.Headers.Location);
        }
    }

    [Fact]
    public async Task An_anonymous_api_call_gets_a_401_and_never_a_redirect_to_the_sign_in_page()
    {
        using var response = await app.Anonymous().GetAsync("/api/cases");

        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Null(response.Headers.Location);
    }

    [Fact]
    public async Task An_unknown_or_revoked_token_is_refused_with_401()
    {
        var unknown = app.Anonymous();
        unknown.DefaultRequestHeaders.Authorization = new("Bearer", "ert_" + new string('0', 48));
        var revoked = await app.TokenClientAsync("to be revoked");
        using (var scope = app.Services.CreateScope())
        {
            var admin = scope.ServiceProvider.GetRequiredService<AccountAdmin>();
            var token = (await admin.ListTokensAsync()).Single(t => t.Name == "to be revoked");
            Assert.Equal(HttpStatusCode.OK, (await revoked.GetAsync("/api/sites")).StatusCode);
            await admin.RevokeTokenAsync(token.Id);
        }

        Assert.Equal(HttpStatusCode.Unauthorized, (await unknown.GetAsync("/api/sites")).StatusCode);
        Assert.Equal(HttpStatusCode.Unauthorized, (await revoked.GetAsync("/api/sites")).StatusCode);
    }

    [Fact]
    public async Task A_wrong_password_does_not_sign_in()
    {
        var account = EventReviewFactory.AccountFor(Who.Observer) with { Password = "not-the-password" };

        var ex = await Assert.ThrowsAsync<InvalidOperationException>(() => app.SignedInClientAsync(account));

        Assert.Contains("/signin?error=invalid", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_sign_in_post_without_the_antiforgery_token_is_refused()
    {
        var account = EventReviewFactory.AccountFor(Who.Observer);

        using var response = await app.Anonymous().PostAsync("/account/signin", new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["email"] = account.Email,
            ["password"] = account.Password,
        }));

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.DoesNotContain(response.Headers, h => h.Key == "Set-Cookie" && h.Value.Any(v => v.StartsWith("eventreview.auth=", StringComparison.Ordinal)));
    }

    [Theory]
    [InlineData("/cases")]
    [InlineData("/network")]
    [InlineData("/team")]
    public async Task Pages_send_an_anonymous_visitor_to_the_sign_in_page(string page)
    {
        using var response = await app.Anonymous().GetAsync(page);

        Assert.Equal(HttpStatusCode.Redirect, response.StatusCode);
        Assert.StartsWith("http://localhost/signin", response.Headers.Location?.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_signed_in_reviewer_sees_the_case_list_page_and_cannot_open_the_team_page()
    {
        var reviewer = await app.As(Who.Reviewer);

        using var cases = await reviewer.GetAsync("/cases");
        using var team = await reviewer.GetAsync("/team");

        Assert.Equal(HttpStatusCode.OK, cases.StatusCode);
        Assert.Contains("ER-C-0142", await cases.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.Equal(HttpStatusCode.Redirect, team.StatusCode);
        Assert.Contains("/denied", team.Headers.Location?.ToString(), StringComparison.Ordinal);
    }
}
