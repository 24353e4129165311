using System.Net;
using EventReview.Data;
using EventReview.Data.Auth;
using EventReview.Data.Writes;
using EventReview.Web.Auth;
using EventReview.Web.Operations;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Tests.Security;

/// <summary>Checked tokens are remembered for a few seconds, and a revocation still takes effect when it should.</summary>
public sealed class TokenCacheTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private sealed class MovableClock(DateTimeOffset start) : TimeProvider
    {
        public DateTimeOffset Now { get; set; } = start;

        public override DateTimeOffset GetUtcNow() => Now;
    }

    private async Task<(ApiToken Token, string Secret)> NewTokenAsync(string name)
    {
        using var scope = app.Services.CreateScope();
        return await scope.ServiceProvider.GetRequiredService<AccountAdmin>().CreateTokenAsync(name + " " + Guid.NewGuid().ToString("N")[..6], "tests", TokenScopes.All);
    }

    private ApiTokenCache NewCache(TimeProvider clock, int seconds = 5) => new(
        app.Services.GetRequiredService<IDbContextFactory<AppDbContext>>(), app.Services.GetRequiredService<IWriteGate>(), clock,
        app.Services.GetRequiredService<TokenRevocations>(), Options.Create(new OperationsOptions { TokenCacheSeconds = seconds }));

    [Fact]
    public async Task A_token_revoked_on_this_server_is_refused_on_its_very_next_request()
    {
        var (token, secret) = await NewTokenAsync("revoked in use");
        var client = app.BearerClient(secret);
        using (var before = await client.GetAsync("/api/cases"))
        {
            Assert.Equal(HttpStatusCode.OK, before.StatusCode);
        }

        using (var scope = app.Services.CreateScope())
        {
            await scope.ServiceProvider.GetRequiredService<AccountAdmin>().RevokeTokenAsync(token.Id, "tests");
        }

        using var after = await client.GetAsync("/api/cases");
        Assert.Equal(HttpStatusCode.Unauthorized, after.StatusCode);
        Assert.Equal("revoked", (string?)(await after.JsonAsync())["reason"]);
    }

    [Fact]
    public async Task A_token_revoked_by_another_process_is_refused_once_the_cache_time_has_passed()
    {
        var (token, _) = await NewTokenAsync("revoked elsewhere");
        var clock = new MovableClock(DateTimeOffset.UtcNow);
        var cache = NewCache(clock);
        Assert.Equal(TokenState.Active, (await cache.FindAsync(token.Hash, default))!.StateAt(clock.Now));

        // Another process (the command-line tool) revokes it in the database, not through this server.
        await using (var db = app.Db())
        {
            var row = await db.ApiTokens.SingleAsync(t => t.Id == token.Id);
            row.Revoke(clock.Now);
            await db.SaveChangesAsync();
        }

        clock.Now += TimeSpan.FromSeconds(4.9);
        Assert.Equal(TokenState.Active, (await cache.FindAsync(token.Hash, default))!.StateAt(clock.Now));
        clock.Now += TimeSpan.FromSeconds(0.2);
        Assert.Equal(TokenState.Revoked, (await cache.FindAsync(token.Hash, default))!.StateAt(clock.Now));

        // With the cache turned off, every request reads the database.
        Assert.Equal(TokenState.Revoked, (await NewCache(clock, seconds: 0).FindAsync(token.Hash, default))!.StateAt(clock.Now));
    }

    [Fact]
    public async Task Last_use_is_recorded_at_most_once_a_minute_per_token()
    {
        var (token, _) = await NewTokenAsync("touched");
        var start = DateTimeOffset.UtcNow;
        var clock = new MovableClock(start);
        var cache = NewCache(clock);

        async Task<DateTimeOffset?> UseAsync(TimeSpan after)
        {
            clock.Now = start + after;
            var found = await cache.FindAsync(token.Hash, default);
            await cache.TouchAsync(found!, default);
            await using var db = app.Db();
            return (await db.ApiTokens.AsNoTracking().SingleAsync(t => t.Id == token.Id)).LastUsedAt;
        }

        var first = await UseAsync(TimeSpan.Zero);
        Assert.Equal(start, first);
        Assert.Equal(first, await UseAsync(TimeSpan.FromSeconds(30)));
        Assert.Equal(first, await UseAsync(TimeSpan.FromSeconds(59)));
        var later = await UseAsync(TimeSpan.FromSeconds(61));
        Assert.True(later > first, $"last use {later:O} should have moved past {first:O}");
    }
}
