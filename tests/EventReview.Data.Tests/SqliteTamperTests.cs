using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Data.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests;

/// <summary>
/// An intruder with direct access to the SQLite file (who first drops the append-only trigger in the way) or to the
/// attachment folder changes the record; <see cref="IntegrityVerifier"/> must name the case, the item or timeline entry
/// and what changed. Each test works on a fresh data folder holding two worked cases, one of which is tampered with.
/// </summary>
public sealed class SqliteTamperTests : IAsyncLifetime
{
    /// <summary>The bytes of the worked case's attachment (its SHA-256 is the one <see cref="SampleCases.Worked"/> records).</summary>
    private static readonly byte[] AttachmentBytes = "abc"u8.ToArray();

    private readonly TempFolder _folder = new("er-tamper");
    private DatabaseSettings _settings = default!;
    private AppDbContextFactory _factory = default!;
    private AttachmentStore _store = default!;
    private int _caseId;
    private string _candidate = string.Empty;
    private string _otherCandidate = string.Empty;

    public async Task InitializeAsync()
    {
        _settings = DatabaseSettings.ForSqlite(_folder.Path);
        _factory = new AppDbContextFactory(_settings);
        await DatabaseInitializer.MigrateAsync(_factory);
        _store = new AttachmentStore(_settings);
        var (sha, _) = await _store.SaveAsync(new MemoryStream(AttachmentBytes), 1024);
        Assert.Equal(Hashing.Sha256Hex("abc"), sha);

        var tampered = SampleCases.Worked("TC-TAMPER-" + Guid.NewGuid().ToString("N")[..6]);
        var other = SampleCases.Worked("TC-UNTOUCHED-" + Guid.NewGuid().ToString("N")[..6]);
        await using var db = _factory.CreateDbContext();
        db.Cases.AddRange(tampered, other);
        await db.SaveChangesAsync();
        (_caseId, _candidate, _otherCandidate) = (tampered.Id, tampered.CandidateId, other.CandidateId);
    }

    public Task DisposeAsync()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        _folder.Dispose();
        return Task.CompletedTask;
    }

    private async Task<IReadOnlyList<IntegrityProblem>> VerifyAsync()
    {
        var (cases, database) = await new IntegrityVerifier(_factory, _store, _settings).VerifyAsync();
        Assert.Empty(database);
        Assert.True(cases.Single(c => c.CandidateId == _otherCandidate).Valid, "the untouched case must still verify");
        return cases.SelectMany(c => c.Problems).ToList();
    }

    private async Task IntrudeAsync(params string[] statements)
    {
        await using var db = _factory.CreateDbContext();
        foreach (var sql in statements)
        {
#pragma warning disable EF1002 // the statements are fixed test SQL, with the case id as a number
            await db.Database.ExecuteSqlRawAsync(sql.Replace("@case", _caseId.ToString(System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal));
#pragma warning restore EF1002
        }
    }

    private const string ItemAlphaOne = "(SELECT \"Id\" FROM \"ChecklistItems\" WHERE \"ReviewCaseId\" = @case AND \"Key\" = 'alpha.one')";

    [Fact]
    public async Task A_changed_sign_in_audit_entry_is_named_by_the_whole_record_verification()
    {
        var audit = new EventReview.Data.Auth.AccountAudit(_factory, TimeProvider.System, Microsoft.Extensions.Logging.Abstractions.NullLogger<EventReview.Data.Auth.AccountAudit>.Instance);
        await audit.RecordAsync(EventReview.Data.Auth.AccountEventKinds.SignInFailed, null, "someone@example.org", "198.51.100.4");
        await audit.RecordAsync(EventReview.Data.Auth.AccountEventKinds.SignInSucceeded, "u1", "someone@example.org", "198.51.100.4");
        var (_, before) = await new IntegrityVerifier(_factory, _store, _settings).VerifyAsync();
        Assert.Empty(before);

        await IntrudeAsync(
            "DROP TRIGGER er_AccountEvents_no_update;",
            "UPDATE \"AccountEvents\" SET \"Address\" = '192.0.2.99' WHERE \"Sequence\" = 1;");

        var (_, database) = await new IntegrityVerifier(_factory, _store, _settings).VerifyAsync();
        var problem = Assert.Single(database);
        Assert.Equal("(sign-in audit)", problem.Case);
        Assert.Contains("entry 1", problem.What, StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_team_page_check_walks_only_new_entries_yet_catches_changes_to_them_and_to_its_last_verified_one()
    {
        var audit = new EventReview.Data.Auth.AccountAudit(_factory, TimeProvider.System, Microsoft.Extensions.Logging.Abstractions.NullLogger<EventReview.Data.Auth.AccountAudit>.Instance);
        for (var i = 0; i < 3; i++)
        {
            await audit.RecordAsync(EventReview.Data.Auth.AccountEventKinds.SignInSucceeded, "u1", "someone@example.org", "198.51.100.4");
        }

        Assert.Null(await audit.FirstProblemSinceLastCheckAsync()); // first call: the whole chain, entries 1-3
        await audit.RecordAsync(EventReview.Data.Auth.AccountEventKinds.SignedOut, "u1", "someone@example.org", "198.51.100.4");
        Assert.Null(await audit.FirstProblemSinceLastCheckAsync()); // entry 3 unchanged, entry 4 new

        // A change to an entry added since the last check is caught.
        await audit.RecordAsync(EventReview.Data.Auth.AccountEventKinds.SignInFailed, null, "someone@example.org", "198.51.100.4");
        await IntrudeAsync("DROP TRIGGER er_AccountEvents_no_update;", "UPDATE \"AccountEvents\" SET \"Address\" = '192.0.2.99' WHERE \"Sequence\" = 5;");
        Assert.Contains("entry 5", await audit.FirstProblemSinceLastCheckAsync(), StringComparison.Ordinal);

        // The check then starts over with the whole chain; a change to its last verified entry is caught as well.
        await IntrudeAsync("UPDATE \"AccountEvents\" SET \"Address\" = '198.51.100.4' WHERE \"Sequence\" = 5;");
        Assert.Null(await audit.FirstProblemSinceLastCheckAsync());
        await IntrudeAsync("UPDATE \"AccountEvents\" SET \"Detail\" = 'forged' WHERE \"Sequence\" = 5;");
        Assert.Contains("entry 5", await audit.FirstProblemSinceLastCheckAsync(), StringComparison.Ordinal);

        // Older entries are left to the whole walk (integrity page, eventreview verify), which still finds them.
        await IntrudeAsync("UPDATE \"AccountEvents\" SET \"Detail\" = '' WHERE \"Sequence\" = 5;", "UPDATE \"AccountEvents\" SET \"Address\" = '192.0.2.1' WHERE \"Sequence\" = 2;");
        Assert.Contains("entry 2", await audit.FirstProblemAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_untouched_database_verifies_clean()
    {
        var (cases, database) = await new IntegrityVerifier(_factory, _store, _settings).VerifyAsync();

        Assert.Empty(database);
        Assert.Equal(2, cases.Count);
        Assert.All(cases, c => Assert.Empty(c.Problems));
        await using var db = _factory.CreateDbContext();
        foreach (var c in cases)
        {
            Assert.Equal(await db.Activity.CountAsync(a => a.ReviewCaseId == c.Id), c.Entries);
            Assert.Equal(await db.Activity.Where(a => a.ReviewCaseId == c.Id).OrderByDescending(a => a.Sequence).Select(a => a.Hash).FirstAsync(), c.ChainHead);
        }
    }

    [Fact]
    public async Task The_triggers_stop_the_intruder_until_they_are_dropped()
    {
        var ex = await Assert.ThrowsAnyAsync<System.Data.Common.DbException>(() =>
            IntrudeAsync($"UPDATE \"Evidence\" SET \"Text\" = 'Forged.' WHERE \"ChecklistItemId\" = {ItemAlphaOne}"));

        Assert.Contains("Evidence rows are append-only", ex.Message, StringComparison.Ordinal);
        Assert.Empty(await VerifyAsync());
    }

    [Fact]
    public async Task Altering_a_note_text_is_caught_naming_the_item_and_the_note()
    {
        await IntrudeAsync("DROP TRIGGER er_Evidence_no_update;",
            $"UPDATE \"Evidence\" SET \"Text\" = 'Nothing to see here.' WHERE \"ChecklistItemId\" = {ItemAlphaOne} AND \"Text\" = 'First **note**.'");

        var p = Assert.Single(await VerifyAsync());

        Assert.Equal((_candidate, (int?)null, "alpha.one"), (p.Case, p.Entry, p.Item));
        Assert.Contains("note added by Reviewer Ada", p.What, StringComparison.Ordinal);
        Assert.Contains("was altered: its text no longer matches its SHA-256", p.What, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Altering_a_note_text_together_with_its_hash_is_caught_by_the_seal_in_the_timeline()
    {
        var forged = "Nothing to see here.";
        await IntrudeAsync("DROP TRIGGER er_Evidence_no_update;",
            $"UPDATE \"Evidence\" SET \"Text\" = '{forged}', \"ContentSha256\" = '{Hashing.Sha256Hex(forged)}' WHERE \"ChecklistItemId\" = {ItemAlphaOne} AND \"Text\" = 'First **note**.'");

        var problems = await VerifyAsync();

        Assert.All(problems, p => Assert.Equal((_candidate, "alpha.one"), (p.Case, p.Item)));
        Assert.Contains(problems, p => p.What.Contains("note added by Reviewer Ada does not match the record made when it was added", StringComparison.Ordinal));
        // The item's evidence fingerprint moved too, so its current sign-off no longer covers it.
        Assert.Contains(problems, p => p.What.Contains("current sign-off by Reviewer Bo was given against evidence", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Altering_the_bytes_of_an_attachment_on_disk_is_caught()
    {
        var path = _store.PathFor(Hashing.Sha256Hex("abc"));
        Assert.True(File.Exists(path));
        await File.WriteAllBytesAsync(path, "abd"u8.ToArray());

        var (cases, database) = await new IntegrityVerifier(_factory, _store, _settings).VerifyAsync();

        // Both cases hold the same file (stored once, by its hash): both report it, and nothing else.
        Assert.Empty(database);
        Assert.Equal(2, cases.Count);
        foreach (var c in cases)
        {
            var p = Assert.Single(c.Problems);
            Assert.Equal((c.CandidateId, (int?)null, "alpha.one"), (p.Case, p.Entry, p.Item));
            Assert.Contains("stored bytes of file 'plot.png' (sha256 " + Hashing.Sha256Hex("abc") + ") are missing or altered", p.What, StringComparison.Ordinal);
        }
    }

    [Fact]
    public async Task A_missing_attachment_file_is_caught()
    {
        File.Delete(_store.PathFor(Hashing.Sha256Hex("abc")));

        var (cases, _) = await new IntegrityVerifier(_factory, _store, _settings).VerifyAsync(_caseId);

        var p = Assert.Single(Assert.Single(cases).Problems);
        Assert.Equal("alpha.one", p.Item);
        Assert.Contains("file 'plot.png' (sha256 " + Hashing.Sha256Hex("abc") + ") are missing or altered", p.What, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Moving_the_time_of_a_sign_off_is_caught_naming_the_signer()
    {
        await IntrudeAsync("DROP TRIGGER er_SignOffs_guard;",
            "UPDATE \"SignOffs\" SET \"SignedAtUtc\" = \"SignedAtUtc\" - 36000000000 WHERE \"SignerName\" = 'Reviewer Cy' AND \"ChecklistItemId\" IN (SELECT \"Id\" FROM \"ChecklistItems\" WHERE \"ReviewCaseId\" = @case)");

        var p = Assert.Single(await VerifyAsync());

        Assert.Equal((_candidate, (int?)null, "alpha.two"), (p.Case, p.Entry, p.Item));
        Assert.Contains("sign-off by Reviewer Cy", p.What, StringComparison.Ordinal);
        Assert.Contains("does not match the record made when it was signed: its time, statement, meaning or fingerprint was changed", p.What, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Altering_the_text_of_a_timeline_entry_is_caught_naming_the_entry()
    {
        await IntrudeAsync("DROP TRIGGER er_Activity_no_update;",
            "UPDATE \"Activity\" SET \"Text\" = 'Nothing happened.' WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 3");

        var problems = await VerifyAsync();

        var p = Assert.Single(problems, x => x.Item is null);
        Assert.Equal((_candidate, (int?)3), (p.Case, p.Entry));
        Assert.StartsWith("Timeline: Entry 3 (", p.What, StringComparison.Ordinal);
        Assert.Contains("was altered: its content no longer matches its hash", p.What, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Deleting_a_timeline_entry_is_caught_naming_the_gap()
    {
        await IntrudeAsync("DROP TRIGGER er_Activity_no_delete;",
            "DELETE FROM \"Activity\" WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 4");

        var problems = await VerifyAsync();

        var p = Assert.Single(problems, x => x.Item is null);
        Assert.Equal((_candidate, (int?)5), (p.Case, p.Entry));
        Assert.Contains("Entry 4 is missing (entry 5 follows entry 3)", p.What, StringComparison.Ordinal);
        // Entry 4 recorded the first note; its seal went with it.
        Assert.Contains(problems, x => x.Item == "alpha.one" && x.What.Contains("does not match the record made when it was added", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Inserting_a_forged_evidence_row_is_caught_even_when_its_hash_is_right()
    {
        var text = "All checks passed (added later).";
        var at = SampleCases.T0.AddMinutes(3).UtcTicks;
        await IntrudeAsync(
            "INSERT INTO \"Evidence\" (\"ChecklistItemId\", \"Kind\", \"Text\", \"ContentSha256\", \"AddedBy\", \"AddedByName\", \"AddedAt\") " +
            $"VALUES ({ItemAlphaOne}, 'Note', '{text}', '{Hashing.Sha256Hex(text)}', 'u-rev-a', 'Reviewer Ada', {at})");

        var problems = await VerifyAsync();

        Assert.All(problems, p => Assert.Equal((_candidate, "alpha.one"), (p.Case, p.Item)));
        Assert.Contains(problems, p => p.What.Contains("note added by Reviewer Ada does not match the record made when it was added (row altered or inserted afterwards)", StringComparison.Ordinal));
        Assert.DoesNotContain(problems, p => p.What.Contains("text no longer matches", StringComparison.Ordinal));
    }
}
