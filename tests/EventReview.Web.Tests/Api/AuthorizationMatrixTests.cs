using System.Net;
using EventReview.Data.Auth;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Api;

/// <summary>Every API endpoint against every kind of caller; roles are checked on the server.</summary>
public sealed class AuthorizationMatrixTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    /// <summary>
    /// Every endpoint and page against people (by role) and API tokens (by scope set). People are checked by role, tokens
    /// only by scope; an expired or revoked token is refused (401) everywhere. Pages are for people only, and outside
    /// /api an anonymous visitor is sent to the sign-in page (302) and a person without the role to /denied (302).
    /// </summary>
    public static TheoryData<string, string, int> Matrix()
    {
        var data = new TheoryData<string, string, int>();
        void Row(string endpoint, int anonymous, int observer, int reviewer, int coordinator, int read, int open, int evidence, int pipeline, int all, int refused = 401)
        {
            data.Add(endpoint, Who.Anonymous, anonymous);
            data.Add(endpoint, Who.Observer, observer);
            data.Add(endpoint, Who.Reviewer, reviewer);
            data.Add(endpoint, Who.Coordinator, coordinator);
            data.Add(endpoint, Who.TokenRead, read);
            data.Add(endpoint, Who.TokenOpen, open);
            data.Add(endpoint, Who.TokenEvidence, evidence);
            data.Add(endpoint, Who.TokenPipeline, pipeline);
            data.Add(endpoint, Who.Token, all);
            data.Add(endpoint, Who.TokenExpired, refused);
            data.Add(endpoint, Who.TokenRevoked, refused);
        }

        //                                                  anon obs  rev  coord | read open evid pipe all
        Row("POST /api/cases",                              401, 403, 403, 201,   403, 201, 403, 201, 201);
        Row("GET /api/cases",                               401, 200, 200, 200,   200, 403, 403, 403, 200);
        Row("GET /api/cases/{id}",                          401, 200, 200, 200,   200, 403, 403, 403, 200);
        Row("GET /api/sites",                               401, 200, 200, 200,   200, 403, 403, 403, 200);
        Row("GET /api/cases/{id}/items/{key}/evidence",     401, 200, 200, 200,   200, 403, 403, 403, 200);
        Row("GET /api/cases/{id}/timeline",                 401, 200, 200, 200,   200, 403, 403, 403, 200);
        Row("POST /api/cases/{id}/items/{key}/notes",       401, 403, 201, 201,   403, 403, 201, 201, 201);
        Row("POST /api/cases/{id}/items/{key}/attachments", 401, 403, 201, 201,   403, 403, 201, 201, 201);
        Row("GET /api/cases/{id}/items/{key}/computations", 401, 200, 200, 200,   200, 403, 403, 403, 200);
        Row("GET /api/cases/{id}/items/{key}/signoffs",     401, 200, 200, 200,   200, 403, 403, 403, 200);

        // The API's description is public (a refused token is then simply not used).
        Row("GET /openapi/v1.json",                         200, 200, 200, 200,   200, 200, 200, 200, 200, refused: 200);
        Row("GET /api/docs/ (reference)",                   200, 200, 200, 200,   200, 200, 200, 200, 200, refused: 200);
        Row("GET /files/{sha}",                             302, 200, 200, 200,   200, 403, 403, 403, 200);
        Row("GET /cases/{id}/dossier.zip",                  302, 200, 200, 200,   200, 403, 403, 403, 200);
        Row("GET /network.json",                            302, 200, 200, 200,   200, 403, 403, 403, 200);
        Row("GET /cases (page)",                            302, 200, 200, 200,   403, 403, 403, 403, 403);
        Row("GET /team (page)",                             302, 302, 302, 200,   403, 403, 403, 403, 403);
        Row("GET /tokens (page)",                           302, 302, 302, 200,   403, 403, 403, 403, 403);
        return data;
    }

    [Theory]
    [MemberData(nameof(Matrix))]
    public async Task Each_endpoint_answers_each_caller_with_the_expected_status(string endpoint, string who, int expected)
    {
        var client = await app.As(who);
        var coordinator = await app.As(Who.Coordinator);
        var caseId = await coordinator.CaseIdAsync("ER-C-0142");
        var fileBytes = System.Text.Encoding.UTF8.GetBytes("matrix file");
        if (endpoint == "GET /files/{sha}")
        {
            Assert.Equal(HttpStatusCode.Created, (await coordinator.AttachAsync(caseId, "timing.arrival", fileBytes, "matrix.txt")).StatusCode);
        }

        using var response = endpoint switch
        {
            "POST /api/cases" => await client.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId())),
            "GET /api/cases" => await client.GetAsync("/api/cases"),
            "GET /api/cases/{id}" => await client.GetAsync($"/api/cases/{caseId}"),
            "GET /api/sites" => await client.GetAsync("/api/sites"),
            "GET /api/cases/{id}/items/{key}/evidence" => await client.GetAsync($"/api/cases/{caseId}/items/timing.arrival/evidence"),
            "GET /api/cases/{id}/timeline" => await client.GetAsync($"/api/cases/{caseId}/timeline"),
            "POST /api/cases/{id}/items/{key}/notes" => await client.AddNoteAsync(caseId, "timing.arrival", $"Note by {who}."),
            "POST /api/cases/{id}/items/{key}/attachments" => await client.AttachAsync(caseId, "timing.arrival", System.Text.Encoding.UTF8.GetBytes($"file by {who}")),
            "GET /api/cases/{id}/items/{key}/computations" => await client.GetAsync($"/api/cases/{caseId}/items/timing.arrival/computations"),
            "GET /api/cases/{id}/items/{key}/signoffs" => await client.GetAsync($"/api/cases/{caseId}/items/timing.arrival/signoffs"),
            "GET /openapi/v1.json" => await client.GetAsync("/openapi/v1.json"),
            "GET /api/docs/ (reference)" => await client.GetAsync("/api/docs/"),
            "GET /files/{sha}" => await client.GetAsync($"/files/{EventReview.Core.Evidence.Hashing.Sha256Hex(fileBytes)}?name=matrix.txt"),
            "GET /cases/{id}/dossier.zip" => await client.GetAsync($"/cases/{caseId}/dossier.zip"),
            "GET /network.json" => await client.GetAsync("/network.json"),
            "GET /cases (page)" => await client.GetAsync("/cases"),
            "GET /team (page)" => await client.GetAsync("/team"),
            "GET /tokens (page)" => await client.GetAsync("/tokens"),
            _ => throw new ArgumentOutOfRangeException(nameof(endpoint), endpoint, "no such row"),
        };

        Assert.Equal(expected, (int)response.StatusCode);
        if (expected is 401 or 403)
        {
            Assert.Null(response.Headers.Location);
        }

        if (expected == 302)
        {
            var target = response.Headers.Location?.ToString() ?? string.Empty;
            Assert.True(target.Contains("/signin", StringComparison.Ordinal) == (who == Who.Anonymous) && (target.Contains("/signin", StringComparison.Ordinal) || target.Contains("/denied", StringComparison.Ordinal)), target);
        }
    }

    [Fact]
    public void The_matrix_covers_every_caller_for_every_row()
    {
        var rows = Matrix().Select(r => ((string)r[0], (string)r[1])).ToList();

        Assert.Equal(18 * (Who.People.Count + Who.Tokens.Count), rows.Distinct().Count());
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
            await admin.RevokeTokenAsync(token.Id, "tests");
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
