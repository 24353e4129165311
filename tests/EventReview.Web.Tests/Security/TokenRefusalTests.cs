using System.Net;
using System.Security.Claims;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Security;

/// <summary>Expired, revoked and unknown tokens are refused with a reason; scopes are all a token ever gets.</summary>
public sealed class TokenRefusalTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    [Theory]
    [InlineData(Who.TokenExpired, "expired")]
    [InlineData(Who.TokenRevoked, "revoked")]
    public async Task An_expired_or_revoked_token_gets_401_with_a_problem_saying_which(string who, string reason)
    {
        using var response = await (await app.As(who)).GetAsync("/api/cases");

        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var problem = await response.JsonAsync();
        Assert.Equal(reason, (string?)problem["reason"]);
        Assert.Contains(reason, (string?)problem["detail"], StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_unknown_token_and_a_malformed_one_get_the_same_answer()
    {
        using var unknown = await app.BearerClient("ert_" + new string('a', 48)).GetAsync("/api/cases");
        using var malformed = await app.BearerClient("not-a-token").GetAsync("/api/cases");

        Assert.Equal(HttpStatusCode.Unauthorized, unknown.StatusCode);
        var a = await unknown.JsonAsync();
        var b = await malformed.JsonAsync();
        Assert.Equal(malformed.StatusCode, unknown.StatusCode);
        Assert.Equal(((string?)a["title"], (string?)a["detail"], (string?)a["reason"]), ((string?)b["title"], (string?)b["detail"], (string?)b["reason"]));
        Assert.Equal("invalid", (string?)a["reason"]);
    }

    [Fact]
    public async Task A_token_without_the_scope_gets_403_naming_scopes()
    {
        using var response = await (await app.As(Who.TokenPipeline)).GetAsync("/api/cases");

        Assert.Equal(HttpStatusCode.Forbidden, response.StatusCode);
        Assert.Contains("scopes", (string?)(await response.JsonAsync())["detail"], StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_pipeline_token_gets_what_it_needs_to_continue_from_the_answers_alone()
    {
        var pipeline = await app.As(Who.TokenPipeline);

        var opened = await (await pipeline.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId()))).JsonAsync();
        var caseId = opened["id"]!.GetValue<int>();
        var key = (string)opened["items"]!.AsArray()[0]!["key"]!;
        using var note = await pipeline.AddNoteAsync(caseId, key, "Pipeline summary: network SNR 11.");

        Assert.Equal(HttpStatusCode.Created, note.StatusCode);
        Assert.NotNull((string?)(await note.JsonAsync())["fingerprint"]);
    }

    [Theory]
    [InlineData(Policies.Work)]
    [InlineData(Policies.Coordinate)]
    [InlineData(Policies.Person)]
    public void A_token_with_every_scope_can_never_work_sign_or_coordinate(string policy)
    {
        var token = new ClaimsPrincipal(new ClaimsIdentity(
            [
                new Claim(ClaimTypes.NameIdentifier, "token:1"),
                new Claim(UserClaims.TokenId, "1"),
                new Claim(ClaimTypes.Role, Roles.Coordinator), // even a role claim does not make a token a person
                .. TokenScopes.All.Select(s => new Claim(UserClaims.Scope, s)),
            ], "ApiToken"));

        Assert.False(Permissions.Allows(token, policy));
        Assert.True(Permissions.Allows(token, Policies.Read));
    }
}
