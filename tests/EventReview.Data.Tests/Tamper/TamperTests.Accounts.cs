using EventReview.Data.Auth;
using Microsoft.EntityFrameworkCore;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests.Tamper;

/// <summary>Changes to what the sign-in audit accounts for: accounts and roles, API tokens and their scopes, sealed injection records, the audit itself.</summary>
public abstract partial class TamperTests
{
    private const string Audit = "(sign-in audit)";

    [Fact]
    public async Task An_observer_promoted_to_coordinator_by_hand_is_caught()
    {
        await IntrudeAsync("UPDATE \"AspNetUserRoles\" SET \"RoleId\" = (SELECT \"Id\" FROM \"AspNetRoles\" WHERE \"Name\" = 'coordinator') WHERE \"UserId\" = {0}", ObserverId);

        await CaughtAsync(Audit, $"The account {ObserverId}, role: 'coordinator' in the database, but the sign-in audit says 'observer'");
    }

    [Fact]
    public async Task An_account_added_by_hand_is_unaccounted()
    {
        await IntrudeAsync("INSERT INTO \"AspNetUsers\" (\"Id\", \"DisplayName\", \"UserName\", \"NormalizedUserName\", \"Email\", \"NormalizedEmail\", \"EmailConfirmed\", \"PhoneNumberConfirmed\", \"TwoFactorEnabled\", \"LockoutEnabled\", \"AccessFailedCount\") " +
            "VALUES ('intruder', 'Ivo Intruder', 'ivo@example.org', 'IVO@EXAMPLE.ORG', 'ivo@example.org', 'IVO@EXAMPLE.ORG', {0}, {0}, {0}, {0}, 0)", true);

        await CaughtAsync(Audit, "The account intruder is in the database, but no sign-in audit entry accounts for it");
    }

    [Fact]
    public async Task A_token_given_a_wider_scope_is_caught()
    {
        await IntrudeAsync($"UPDATE \"ApiTokens\" SET \"Scopes\" = 'cases:read cases:open evidence:add' WHERE \"Id\" = {RevokedTokenId}");

        await CaughtAsync(Audit, $"API token {RevokedTokenId}, scopes: 'cases:read cases:open evidence:add' in the database, but the sign-in audit says 'cases:read'");
    }

    [Fact]
    public async Task A_revoked_token_brought_back_is_caught()
    {
        await IntrudeAsync($"UPDATE \"ApiTokens\" SET \"RevokedAt\" = NULL WHERE \"Id\" = {RevokedTokenId}");

        await CaughtAsync(Audit, $"API token {RevokedTokenId}, revoked at (UTC ticks): '(none)' in the database");
    }

    [Fact]
    public async Task A_token_added_by_hand_is_unaccounted()
    {
        await IntrudeAsync("INSERT INTO \"ApiTokens\" (\"Name\", \"Hash\", \"Role\", \"CreatedBy\", \"CreatedAt\", \"Scopes\", \"ExpiresAt\") " +
            "VALUES ('backdoor', {0}, 'pipeline', 'nobody', {1}, 'cases:read cases:open evidence:add', {2})",
            new string('b', 64), Stored(SampleCases.T0), Stored(SampleCases.T0.AddDays(300)));

        var problems = await VerifyAsync();
        Assert.Contains(problems, p => p.Case == Audit && p.What.StartsWith("API token ", StringComparison.Ordinal) && p.What.Contains("no sign-in audit entry accounts for it", StringComparison.Ordinal));
    }

    [Fact]
    public async Task A_sealed_record_marked_opened_by_hand_is_caught()
    {
        await IntrudeAsync($"UPDATE \"SealedInjectionRecords\" SET \"OpenedAt\" = {{0}}, \"OpenedById\" = 'u-coord', \"OpenedByName\" = 'Coordinator Cole' WHERE \"Id\" = {SealId}",
            Stored(SampleCases.T0.AddDays(2)));

        await CaughtAsync(Audit, $"Sealed injection record {SealId}, opened at (UTC ticks):", "in the database, but the sign-in audit says '(none)'");
    }

    [Fact]
    public async Task A_changed_sign_in_audit_entry_is_caught()
    {
        await IntrudeAsync("UPDATE \"AccountEvents\" SET \"Address\" = '192.0.2.99' WHERE \"Sequence\" = 1");

        var p = await CaughtAsync(Audit, "entry 1");
        Assert.Contains("altered", p.What, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_rewritten_sign_in_audit_without_the_key_is_caught_by_its_signatures()
    {
        // Re-hash the whole audit after changing the first entry: the chain holds, the MACs do not.
        await using (var db = Factory.CreateDbContext())
        {
            await DropGuardsAsync(db);
            var events = await db.AccountEvents.AsNoTracking().OrderBy(e => e.Sequence).ToListAsync();
            var previous = AccountEvent.GenesisHash;
            foreach (var e in events)
            {
                var copy = AccountEvent.Next(e.Sequence, previous, e.At, e.Kind, e.UserId, e.Account, e.Sequence == 1 ? "192.0.2.99" : e.Address, e.Detail,
                    Core.Records.FactText.Parse(e.Facts!));
                await db.Database.ExecuteSqlRawAsync("UPDATE \"AccountEvents\" SET \"Address\" = {0}, \"PreviousHash\" = {1}, \"Hash\" = {2} WHERE \"Id\" = {3}", copy.Address, previous, copy.Hash, e.Id);
                previous = copy.Hash;
            }
        }

        await CaughtAsync(Audit, "Sign-in audit entry 1", "does not match its signature");
    }

    [Fact]
    public async Task Removing_the_newest_sign_in_audit_entry_is_caught_by_the_witness()
    {
        long last;
        await using (var db = Factory.CreateDbContext())
        {
            last = await db.AccountEvents.MaxAsync(e => e.Sequence);
        }

        await IntrudeAsync($"DELETE FROM \"AccountEvents\" WHERE \"Sequence\" = {last}");

        await CaughtAsync(Audit, "The newest sign-in audit entries were removed", $"the witness saw entry {last}");
    }
}
