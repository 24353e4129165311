using System.Data.Common;
using EventReview.Core.Cases;
using EventReview.Core.Configuration;
using EventReview.Data.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests;

/// <summary>
/// The database itself keeps the record append-only (triggers written out in the `Initial` migration of each provider): direct SQL cannot
/// update or delete timeline entries, evidence or computation records, cannot delete sign-offs or change them other
/// than current to stale, and cannot change or delete a frozen configuration record. Run on every provider.
/// </summary>
public abstract partial class DataStoreTests
{
    /// <summary>A time as the provider stores it (SQLite: UTC ticks; PostgreSQL: timestamp with time zone), for raw SQL parameters.</summary>
    protected abstract object StoredTime(DateTimeOffset at);

    private const string ItemsOfCase = "\"ChecklistItemId\" IN (SELECT \"Id\" FROM \"ChecklistItems\" WHERE \"ReviewCaseId\" = {0})";

    private async Task<DbException> RefusedAsync(string sql, params object[] parameters)
    {
        await using var db = Factory.CreateDbContext();
        return await Assert.ThrowsAnyAsync<DbException>(() => db.Database.ExecuteSqlRawAsync(sql, parameters));
    }

    private async Task<int> ExecuteAsync(string sql, params object[] parameters)
    {
        await using var db = Factory.CreateDbContext();
        return await db.Database.ExecuteSqlRawAsync(sql, parameters);
    }

    [Theory]
    [InlineData("Timeline", "UPDATE \"Timeline\" SET \"Text\" = 'forged' WHERE \"ReviewCaseId\" = {0}", "updated")]
    [InlineData("Timeline", "DELETE FROM \"Timeline\" WHERE \"ReviewCaseId\" = {0}", "deleted")]
    [InlineData("Evidence", "UPDATE \"Evidence\" SET \"Text\" = 'forged' WHERE " + ItemsOfCase, "updated")]
    [InlineData("Evidence", "DELETE FROM \"Evidence\" WHERE " + ItemsOfCase, "deleted")]
    [InlineData("Computations", "UPDATE \"Computations\" SET \"Summary\" = 'forged' WHERE " + ItemsOfCase, "updated")]
    [InlineData("Computations", "DELETE FROM \"Computations\" WHERE " + ItemsOfCase, "deleted")]
    public async Task Direct_sql_cannot_update_or_delete_timeline_evidence_or_computation_rows(string table, string sql, string verb)
    {
        var original = SampleCases.Worked(NewCandidateId());
        var id = await SaveNewAsync(original);

        var ex = await RefusedAsync(sql, id);

        Assert.Contains($"{table} rows are append-only: they cannot be {verb}", ex.Message, StringComparison.Ordinal);
        var loaded = await LoadAsync(id);
        Assert.Equal(original.Timeline.Select(a => (a.Sequence, a.Text)), loaded.Timeline.OrderBy(a => a.Sequence).Select(a => (a.Sequence, a.Text)));
        Assert.Equal(original.Items.SelectMany(i => i.Evidence).Select(e => e.Text).Order(), loaded.Items.SelectMany(i => i.Evidence).Select(e => e.Text).Order());
        Assert.Equal(original.Items.SelectMany(i => i.Computations).Select(r => r.Summary), loaded.Items.SelectMany(i => i.Computations).Select(r => r.Summary));
        Assert.Null(TimelineChain.FirstProblem(loaded.Timeline));
    }

    [Fact]
    public async Task Direct_sql_cannot_delete_a_sign_off()
    {
        var id = await SaveNewAsync(SampleCases.Worked(NewCandidateId()));

        var ex = await RefusedAsync("DELETE FROM \"SignOffs\" WHERE " + ItemsOfCase, id);

        Assert.Contains("Sign-offs cannot be deleted", ex.Message, StringComparison.Ordinal);
        Assert.Equal(3, (await LoadAsync(id)).Items.Sum(i => i.SignOffs.Count));
    }

    [Fact]
    public async Task Evidence_added_to_a_signed_item_of_a_stored_case_marks_its_sign_off_stale_through_the_triggers()
    {
        var id = await SaveNewAsync(SampleCases.Worked(NewCandidateId()));
        var at = SampleCases.T0.AddHours(3);

        await using (var db = Factory.CreateDbContext())
        {
            var c = await db.CasesWithEverything().SingleAsync(x => x.Id == id);
            c.AddEvidence("alpha.two", Core.Evidence.EvidenceItem.Note("A late correction.", SampleCases.ReviewerA, at), SampleCases.ReviewerA, at);
            await db.SaveChangesAsync();
        }

        var loaded = await LoadAsync(id);
        var signOff = loaded.Item("alpha.two").SignOffs.Single();
        Assert.True(signOff.IsStale);
        Assert.Equal(EventReview.Core.Time.RecordedTime.Normalize(at), signOff.StaleSince!.Value); // stale marks are kept to the millisecond
        Assert.Null(TimelineChain.FirstProblem(loaded.Timeline));
    }

    [Fact]
    public async Task Direct_sql_can_mark_a_current_sign_off_stale_exactly_once()
    {
        var id = await SaveNewAsync(SampleCases.Worked(NewCandidateId()));
        var signOffId = (await LoadAsync(id)).Item("alpha.two").SignOffs.Single().Id;
        var at = StoredTime(SampleCases.T0.AddHours(2));

        var marked = await ExecuteAsync("UPDATE \"SignOffs\" SET \"IsStale\" = {0}, \"StaleSince\" = {1} WHERE \"Id\" = {2}", true, at, signOffId);
        var again = await RefusedAsync("UPDATE \"SignOffs\" SET \"IsStale\" = {0} WHERE \"Id\" = {1}", true, signOffId);
        var revived = await RefusedAsync("UPDATE \"SignOffs\" SET \"IsStale\" = {0}, \"StaleSince\" = NULL WHERE \"Id\" = {1}", false, signOffId);

        Assert.Equal(1, marked);
        Assert.Contains("A sign-off can only be marked stale; nothing else about it can change", again.Message, StringComparison.Ordinal);
        Assert.Contains("A sign-off can only be marked stale; nothing else about it can change", revived.Message, StringComparison.Ordinal);
        var signOff = (await LoadAsync(id)).Item("alpha.two").SignOffs.Single();
        Assert.True(signOff.IsStale);
        Assert.Equal(SampleCases.T0.AddHours(2), signOff.StaleSince!.Value, TimeSpan.FromTicks(1000));
    }

    public static TheoryData<string, string> SignOffChanges() => new()
    {
        { "statement", "UPDATE \"SignOffs\" SET \"Statement\" = 'I never said that.' WHERE \"Id\" = {0}" },
        { "signer", "UPDATE \"SignOffs\" SET \"SignerName\" = 'Someone Else', \"UserId\" = 'u-other' WHERE \"Id\" = {0}" },
        { "meaning", "UPDATE \"SignOffs\" SET \"Meaning\" = 'Approved' WHERE \"Id\" = {0}" },
        { "fingerprint", "UPDATE \"SignOffs\" SET \"EvidenceFingerprint\" = 'ffffffffffffffffffffffffffffffffffffffffffffffffffffffffffffffff' WHERE \"Id\" = {0}" },
        { "gps time", "UPDATE \"SignOffs\" SET \"SignedAtGpsNanoseconds\" = \"SignedAtGpsNanoseconds\" + 1 WHERE \"Id\" = {0}" },
        { "item", "UPDATE \"SignOffs\" SET \"ChecklistItemId\" = \"ChecklistItemId\" + 1 WHERE \"Id\" = {0}" },
    };

    [Theory]
    [MemberData(nameof(SignOffChanges))]
    public async Task Direct_sql_cannot_change_anything_else_about_a_sign_off_current_or_while_marking_it_stale(string what, string sql)
    {
        var id = await SaveNewAsync(SampleCases.Worked(NewCandidateId()));
        var before = (await LoadAsync(id)).Item("alpha.two").SignOffs.Single();

        var plain = await RefusedAsync(sql, before.Id);
        var withStale = await RefusedAsync(sql.Replace(" WHERE ", ", \"IsStale\" = {1} WHERE ", StringComparison.Ordinal), before.Id, true);

        Assert.Contains("A sign-off can only be marked stale", plain.Message, StringComparison.Ordinal);
        Assert.Contains("A sign-off can only be marked stale", withStale.Message, StringComparison.Ordinal);
        var after = (await LoadAsync(id)).Item("alpha.two").SignOffs.Single();
        Assert.True((before.Statement, before.SignerName, before.Meaning, before.EvidenceFingerprint, before.SignedAtGpsNanoseconds, before.IsStale)
            == (after.Statement, after.SignerName, after.Meaning, after.EvidenceFingerprint, after.SignedAtGpsNanoseconds, after.IsStale), what);
    }

    [Fact]
    public async Task Direct_sql_cannot_change_the_time_of_a_sign_off()
    {
        var id = await SaveNewAsync(SampleCases.Worked(NewCandidateId()));
        var before = (await LoadAsync(id)).Item("alpha.two").SignOffs.Single();

        var ex = await RefusedAsync("UPDATE \"SignOffs\" SET \"SignedAtUtc\" = {0} WHERE \"Id\" = {1}", StoredTime(before.SignedAtUtc.AddMinutes(-30)), before.Id);

        Assert.Contains("A sign-off can only be marked stale; nothing else about it can change", ex.Message, StringComparison.Ordinal);
        Assert.Equal(before.SignedAtUtc, (await LoadAsync(id)).Item("alpha.two").SignOffs.Single().SignedAtUtc, TimeSpan.FromTicks(1000));
    }

    /// <summary>Whole seconds: the app stores recorded times in whole milliseconds, which every provider keeps exactly.</summary>
    private static readonly DateTimeOffset Captured = new(2026, 3, 1, 12, 0, 0, TimeSpan.Zero);

    private async Task<(int CaseId, int SnapshotId)> SaveSnapshotAsync()
    {
        var caseId = await SaveNewAsync(SampleCases.Open(NewCandidateId()));
        var snapshot = ConfigurationSnapshot.Capture("KX", "after maintenance",
            new Dictionary<string, string> { ["daq.firmware"] = "4.2.1", ["calibration.version"] = "C07", ["seal.rack3"] = "S-0042" },
            SampleCases.ReviewerA, Captured, caseId);
        await using var db = Factory.CreateDbContext();
        db.ConfigurationSnapshots.Add(snapshot);
        await db.SaveChangesAsync();
        return (caseId, snapshot.Id);
    }

    [Fact]
    public async Task An_unfrozen_configuration_record_can_be_frozen_once_and_then_never_changed_or_deleted_even_with_direct_sql()
    {
        var (caseId, snapshotId) = await SaveSnapshotAsync();
        string fingerprint;
        await using (var db = Factory.CreateDbContext())
        {
            var s = await db.ConfigurationSnapshots.SingleAsync(x => x.Id == snapshotId);
            s.Freeze(caseId, Captured, Captured.AddDays(7), "Candidate under review.", SampleCases.Coordinator, Captured.AddMinutes(5));
            await db.SaveChangesAsync();
            fingerprint = s.Fingerprint!;
        }

        var label = await RefusedAsync("UPDATE \"ConfigurationSnapshots\" SET \"Label\" = 'quietly edited' WHERE \"Id\" = {0}", snapshotId);
        var items = await RefusedAsync("UPDATE \"ConfigurationSnapshots\" SET \"ItemsJson\" = '{{\"daq.firmware\":\"9.9.9\"}}' WHERE \"Id\" = {0}", snapshotId);
        var refreeze = await RefusedAsync("UPDATE \"ConfigurationSnapshots\" SET \"FreezeUntil\" = {0}, \"FreezeReason\" = 'longer' WHERE \"Id\" = {1}", StoredTime(Captured.AddDays(30)), snapshotId);
        var thaw = await RefusedAsync("UPDATE \"ConfigurationSnapshots\" SET \"IsFrozen\" = {0} WHERE \"Id\" = {1}", false, snapshotId);
        var delete = await RefusedAsync("DELETE FROM \"ConfigurationSnapshots\" WHERE \"Id\" = {0}", snapshotId);

        // SQLite says "changed", PostgreSQL "updated": both name the frozen record.
        Assert.All(new[] { label, items, refreeze, thaw }, ex => Assert.Contains("A frozen configuration record cannot be", ex.Message, StringComparison.Ordinal));
        Assert.Contains("A frozen configuration record cannot be deleted", delete.Message, StringComparison.Ordinal);
        await using var check = Factory.CreateDbContext();
        var stored = await check.ConfigurationSnapshots.AsNoTracking().SingleAsync(x => x.Id == snapshotId);
        Assert.True(stored.IsFrozen);
        Assert.Equal(("after maintenance", "4.2.1", "Candidate under review.", fingerprint), (stored.Label, stored.Items["daq.firmware"], stored.FreezeReason, stored.Fingerprint));
        Assert.Equal(fingerprint, ConfigurationCanonical.Fingerprint(stored));
    }

    [Fact]
    public async Task A_frozen_configuration_record_refuses_a_second_freeze_through_the_app()
    {
        var (caseId, snapshotId) = await SaveSnapshotAsync();
        await using var db = Factory.CreateDbContext();
        var s = await db.ConfigurationSnapshots.SingleAsync(x => x.Id == snapshotId);
        s.Freeze(caseId, SampleCases.T0, SampleCases.T0.AddDays(7), "First freeze.", SampleCases.Coordinator, SampleCases.T0.AddMinutes(5));
        await db.SaveChangesAsync();

        var ex = Assert.Throws<DomainRuleException>(() => s.Freeze(caseId, SampleCases.T0, SampleCases.T0.AddDays(9), "Second freeze.", SampleCases.Coordinator, SampleCases.T0.AddMinutes(6)));

        Assert.Equal("already-frozen", ex.Rule);
        Assert.Equal(0, await db.SaveChangesAsync());
    }

    [Fact]
    public async Task An_unfrozen_configuration_record_is_not_locked_by_the_database()
    {
        var (_, snapshotId) = await SaveSnapshotAsync();

        var relabelled = await ExecuteAsync("UPDATE \"ConfigurationSnapshots\" SET \"Label\" = 'relabelled before freezing' WHERE \"Id\" = {0}", snapshotId);
        var deleted = await ExecuteAsync("DELETE FROM \"ConfigurationSnapshots\" WHERE \"Id\" = {0}", snapshotId);

        Assert.Equal((1, 1), (relabelled, deleted));
    }
}
