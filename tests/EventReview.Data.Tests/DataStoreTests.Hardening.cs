using System.Data.Common;
using EventReview.Data.Auth;
using Microsoft.EntityFrameworkCore;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests;

/// <summary>Token scopes and expiry round-trip, and the sign-in audit is hash-chained and append-only, on every provider.</summary>
public abstract partial class DataStoreTests
{
    [Fact]
    public async Task A_token_keeps_its_scopes_and_expiry_and_is_expired_from_that_time_on()
    {
        var created = new DateTimeOffset(2026, 3, 1, 12, 0, 0, TimeSpan.Zero);
        var (token, _) = ApiToken.Create("reader " + Guid.NewGuid().ToString("N")[..6], "tests", created, ["evidence:add", "cases:read"], 30);
        await using (var db = Factory.CreateDbContext())
        {
            db.ApiTokens.Add(token);
            await db.SaveChangesAsync();
        }

        await using var read = Factory.CreateDbContext();
        var found = await read.ApiTokens.SingleAsync(t => t.Id == token.Id);
        Assert.Equal([TokenScopes.CasesRead, TokenScopes.EvidenceAdd], found.ScopeList);
        Assert.Equal(created.AddDays(30), found.ExpiresAt);
        Assert.Equal(TokenState.Active, found.StateAt(created.AddDays(30).AddTicks(-10)));
        Assert.Equal(TokenState.Expired, found.StateAt(created.AddDays(30)));
    }

    [Fact]
    public async Task The_sign_in_audit_is_a_hash_chain_that_direct_sql_cannot_change_or_delete()
    {
        var audit = new AccountAudit(Factory, new FixedClock(new DateTimeOffset(2026, 5, 1, 8, 0, 0, TimeSpan.Zero)), Microsoft.Extensions.Logging.Abstractions.NullLogger<AccountAudit>.Instance);
        var marker = "audit-" + Guid.NewGuid().ToString("N")[..8] + "@demo.invalid";
        await audit.RecordAsync(AccountEventKinds.SignInFailed, null, marker, "192.0.2.7");
        await audit.RecordAsync(AccountEventKinds.SignInSucceeded, "u-1", marker, "192.0.2.7");

        var (page, total) = await audit.PageAsync(0, 2);
        Assert.True(total >= 2);
        Assert.Equal([AccountEventKinds.SignInSucceeded, AccountEventKinds.SignInFailed], page.Select(e => e.Kind));
        Assert.Equal(page[1].Hash, page[0].PreviousHash);
        Assert.Null(await audit.FirstProblemAsync());

        await using var db = Factory.CreateDbContext();
        var update = await Assert.ThrowsAnyAsync<DbException>(() => db.Database.ExecuteSqlRawAsync("UPDATE \"AccountEvents\" SET \"Account\" = 'forged' WHERE \"Account\" = {0}", marker));
        var delete = await Assert.ThrowsAnyAsync<DbException>(() => db.Database.ExecuteSqlRawAsync("DELETE FROM \"AccountEvents\" WHERE \"Account\" = {0}", marker));
        Assert.Contains("AccountEvents rows are append-only", update.Message, StringComparison.Ordinal);
        Assert.Contains("AccountEvents rows are append-only", delete.Message, StringComparison.Ordinal);
        Assert.Equal(2, await db.AccountEvents.CountAsync(e => e.Account == marker));
    }
}
