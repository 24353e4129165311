using System.Net;
using EventReview.Data.Auth;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Security;

/// <summary>Sign-in posts per address, API calls per token and per address: 429 with Retry-After once over the limit.</summary>
public sealed class RateLimitTests(SmallLimitsFactory app) : IClassFixture<SmallLimitsFactory>
{
    [Fact]
    public async Task Sign_in_posts_over_the_limit_get_429_with_retry_after_and_a_clear_message()
    {
        var client = app.Anonymous();
        var statuses = new List<HttpStatusCode>();
        HttpResponseMessage? refused = null;
        for (var i = 0; i < SmallLimitsFactory.SignInPerMinute + 2; i++)
        {
            var r = await EventReviewFactory.PostSignInAsync(client, "nobody@demo.invalid", "Wrong-password-1");
            statuses.Add(r.StatusCode);
            refused ??= r.StatusCode == HttpStatusCode.TooManyRequests ? r : null;
        }

        Assert.Equal(Enumerable.Repeat(HttpStatusCode.Redirect, SmallLimitsFactory.SignInPerMinute), statuses.Take(SmallLimitsFactory.SignInPerMinute));
        Assert.NotNull(refused);
        Assert.InRange(int.Parse(refused.Headers.GetValues("Retry-After").Single(), System.Globalization.CultureInfo.InvariantCulture), 1, 60);
        Assert.Contains("Too many sign-in attempts from your address", await refused.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_token_over_its_rate_gets_429_problem_with_retry_after_while_another_token_is_unaffected()
    {
        var busy = await app.TokenClientAsync("busy", [TokenScopes.CasesRead]);
        var quiet = await app.TokenClientAsync("quiet", [TokenScopes.CasesRead]);
        var responses = new List<HttpResponseMessage>();
        for (var i = 0; i < SmallLimitsFactory.TokenBurst + 8; i++)
        {
            responses.Add(await busy.GetAsync("/api/sites"));
        }

        var refused = responses.FirstOrDefault(r => r.StatusCode == HttpStatusCode.TooManyRequests);
        Assert.NotNull(refused);
        Assert.Equal("application/problem+json", refused.Content.Headers.ContentType?.MediaType);
        Assert.True(refused.Headers.RetryAfter is not null, "Retry-After header missing");
        var problem = await refused.JsonAsync();
        Assert.Equal(429, problem["status"]!.GetValue<int>());
        Assert.Contains("API token", (string?)problem["detail"], StringComparison.Ordinal);
        Assert.Equal(HttpStatusCode.OK, (await quiet.GetAsync("/api/sites")).StatusCode);
    }

    [Fact]
    public async Task Api_calls_without_a_valid_token_are_limited_per_address()
    {
        var unknown = app.BearerClient("ert_" + new string('1', 48));
        var statuses = new List<HttpStatusCode>();
        for (var i = 0; i < SmallLimitsFactory.AddressPerMinute + 2; i++)
        {
            statuses.Add((await unknown.GetAsync("/api/sites")).StatusCode);
        }

        Assert.Contains(HttpStatusCode.Unauthorized, statuses);
        Assert.Equal(HttpStatusCode.TooManyRequests, statuses[^1]);
    }
}
