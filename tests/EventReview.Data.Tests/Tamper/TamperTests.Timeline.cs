using EventReview.Core.Evidence;
using Microsoft.EntityFrameworkCore;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests.Tamper;

/// <summary>Changes to the timeline itself: edits, re-hashing without the key, deletions, insertions, reordering, truncation.</summary>
public abstract partial class TamperTests
{
    [Fact]
    public async Task An_untouched_record_verifies_clean_with_every_entry_signed_and_witnessed()
    {
        var (cases, database) = await new IntegrityVerifier(Factory, Store, Settings, Records).VerifyAsync();

        Assert.Empty(database);
        Assert.Equal(2, cases.Count);
        Assert.All(cases, c => Assert.True(c.Valid, string.Join("; ", c.Problems.Select(p => p.What))));
        Assert.All(await EntriesAsync(), e => Assert.Equal(Records.Keys.Current!.KeyId, e.KeyId));
        var witness = Records.Witness.Read();
        Assert.Equal((await EntriesAsync())[^1].Hash, witness.Newest["case:" + Candidate].Head.Hash);
    }

    [Fact]
    public async Task The_triggers_stop_the_intruder_until_they_are_dropped()
    {
        await using (var db = Factory.CreateDbContext())
        {
#pragma warning disable EF1002 // fixed test SQL with the case id as a number
            var ex = await Assert.ThrowsAnyAsync<Exception>(() => db.Database.ExecuteSqlRawAsync(
                $"UPDATE \"Evidence\" SET \"Text\" = 'Forged.' WHERE \"ChecklistItemId\" = {Item("alpha.one").Replace("@case", CaseId.ToString(System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal)}"));
#pragma warning restore EF1002
            Assert.Contains("append-only", ex.Message, StringComparison.Ordinal);
        }

        Assert.Empty(await VerifyAsync());
    }

    [Fact]
    public async Task Altering_the_text_of_an_entry_is_caught_naming_the_entry()
    {
        await IntrudeAsync("UPDATE \"Timeline\" SET \"Text\" = 'Nothing happened.' WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 3");

        var p = await CaughtAsync(null, "Timeline: Entry 3 (", "was altered: its content no longer matches its hash");
        Assert.Equal(3, p.Entry);
    }

    [Fact]
    public async Task An_edit_followed_by_a_recomputed_chain_is_caught_by_the_signature_of_the_first_rewritten_entry()
    {
        await RewriteChainAsync(6, e => (e.Text + " Checked twice.", e.Facts));

        var p = await CaughtAsync(null, "entry 6 (", "does not match its signature", "without the record key");
        Assert.Equal(6, p.Entry);
        Assert.DoesNotContain(await VerifyAsync(), x => x.What.Contains("no longer matches its hash", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Forged_facts_with_a_recomputed_chain_are_caught_by_the_signature()
    {
        // The forger makes the record itself say the case was closed as astrophysical, and re-hashes everything after it.
        var last = (await EntriesAsync())[^1].Sequence;
        await RewriteChainAsync(last, e => (e.Text, e.Facts + "\ncase.state=Closed\ncase.outcome=Astrophysical"));

        await CaughtAsync(null, $"entry {last} (", "does not match its signature");
    }

    [Fact]
    public async Task Removing_the_signature_of_an_entry_is_caught()
    {
        await IntrudeAsync("UPDATE \"Timeline\" SET \"Mac\" = NULL, \"KeyId\" = NULL WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 4");

        await CaughtAsync(null, "entry 4 (", "carries no signature");
    }

    [Fact]
    public async Task Copying_the_signature_of_another_entry_is_caught()
    {
        await IntrudeAsync("UPDATE \"Timeline\" SET \"Mac\" = (SELECT a.\"Mac\" FROM \"Timeline\" a WHERE a.\"ReviewCaseId\" = @case AND a.\"Sequence\" = 2) WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 5");

        await CaughtAsync(null, "entry 5 (", "does not match its signature");
    }

    [Fact]
    public async Task Deleting_an_entry_in_the_middle_is_caught_naming_the_gap()
    {
        await IntrudeAsync("DELETE FROM \"Timeline\" WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 4");

        var p = await CaughtAsync(null, "Entry 4 is missing (entry 5 follows entry 3)");
        Assert.Equal(5, p.Entry);
    }

    [Fact]
    public async Task Removing_the_newest_entry_is_caught_by_the_witness()
    {
        var last = (await EntriesAsync())[^1].Sequence;
        await IntrudeAsync($"DELETE FROM \"Timeline\" WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = {last}");

        var p = await CaughtAsync(null, "the newest entries were removed", $"the witness saw entry {last}", $"the timeline ends at entry {last - 1}");
        Assert.Equal(last, p.Entry);
    }

    [Fact]
    public async Task Removing_the_newest_entries_with_everything_they_added_is_caught_by_the_witness()
    {
        // The last two entries set a due date and froze the configuration: undo both and delete them.
        var entries = await EntriesAsync();
        await IntrudeAsync($"DELETE FROM \"Timeline\" WHERE \"ReviewCaseId\" = @case AND \"Sequence\" >= {entries[^2].Sequence}");
        await IntrudeAsync($"DELETE FROM \"Computations\" WHERE \"Verdict\" = 'frozen' AND \"ChecklistItemId\" = {Item("beta.one")}");
        await IntrudeAsync($"UPDATE \"ConfigurationSnapshots\" SET \"IsFrozen\" = {{0}} WHERE \"Id\" = {FrozenId}", false);

        await CaughtAsync(null, "the newest entries were removed", $"the witness saw entry {entries[^1].Sequence}");
    }

    [Fact]
    public async Task Deleting_a_whole_case_is_caught_by_the_witness()
    {
        await IntrudeAsync("DELETE FROM \"Timeline\" WHERE \"ReviewCaseId\" = @case");
        await IntrudeAsync("DELETE FROM \"SignOffs\" WHERE \"ChecklistItemId\" IN (SELECT \"Id\" FROM \"ChecklistItems\" WHERE \"ReviewCaseId\" = @case)");
        await IntrudeAsync("DELETE FROM \"Evidence\" WHERE \"ChecklistItemId\" IN (SELECT \"Id\" FROM \"ChecklistItems\" WHERE \"ReviewCaseId\" = @case)");
        await IntrudeAsync("DELETE FROM \"Computations\" WHERE \"ChecklistItemId\" IN (SELECT \"Id\" FROM \"ChecklistItems\" WHERE \"ReviewCaseId\" = @case)");
        await IntrudeAsync("DELETE FROM \"ChecklistItems\" WHERE \"ReviewCaseId\" = @case");
        await IntrudeAsync("DELETE FROM \"ConfigurationSnapshots\" WHERE \"ReviewCaseId\" = @case");
        await IntrudeAsync("DELETE FROM \"Cases\" WHERE \"Id\" = @case");

        await CaughtAsync(Candidate, $"Case {Candidate} is missing from the database", "the witness saw its timeline");
    }

    [Fact]
    public async Task Inserting_an_entry_with_a_correct_hash_but_no_key_is_caught()
    {
        var last = (await EntriesAsync())[^1];
        var at = last.At.AddMinutes(1);
        var hash = Core.Cases.TimelineEntry.ComputeHash(Candidate, last.Sequence + 1, at, "u-coord", "Coordinator Cole", "case.closed", null, "Case closed as astrophysical.",
            "case.state=Closed\ncase.outcome=Astrophysical\ncase.closing=Done.", last.Hash);
        await IntrudeAsync("INSERT INTO \"Timeline\" (\"ReviewCaseId\", \"CandidateId\", \"Sequence\", \"At\", \"ActorId\", \"ActorName\", \"Kind\", \"ItemKey\", \"Text\", \"PreviousHash\", \"Hash\", \"Facts\") " +
            "VALUES (@case, {0}, {1}, {2}, 'u-coord', 'Coordinator Cole', 'case.closed', NULL, 'Case closed as astrophysical.', {3}, {4}, {5})",
            Candidate, last.Sequence + 1, Stored(at), last.Hash, hash, "case.state=Closed\ncase.outcome=Astrophysical\ncase.closing=Done.");

        await CaughtAsync(null, $"entry {last.Sequence + 1} (case.closed", "carries no signature");
    }

    [Fact]
    public async Task Swapping_two_entries_is_caught()
    {
        await IntrudeAsync("UPDATE \"Timeline\" SET \"Sequence\" = 1000 WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 4");
        await IntrudeAsync("UPDATE \"Timeline\" SET \"Sequence\" = 4 WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 5");
        await IntrudeAsync("UPDATE \"Timeline\" SET \"Sequence\" = 5 WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 1000");

        var p = await CaughtAsync(null, "Entry 4 (", "does not link to entry 3");
        Assert.Equal(4, p.Entry);
    }

    [Fact]
    public async Task Moving_an_entry_to_another_case_is_caught_in_both()
    {
        await IntrudeAsync("UPDATE \"Timeline\" SET \"ReviewCaseId\" = (SELECT \"Id\" FROM \"Cases\" WHERE \"CandidateId\" = {0}), \"Sequence\" = 999 WHERE \"ReviewCaseId\" = @case AND \"Sequence\" = 3", Other);

        var (cases, _) = await new IntegrityVerifier(Factory, Store, Settings, Records).VerifyAsync();
        Assert.All(cases, c => Assert.False(c.Valid));
        Assert.Contains(cases.Single(c => c.CandidateId == Candidate).Problems, p => p.What.Contains("Entry 3 is missing", StringComparison.Ordinal));
    }

    [Fact]
    public async Task An_unreadable_state_is_named_by_the_repair_check_and_does_not_stop_verification()
    {
        await IntrudeAsync("UPDATE \"Cases\" SET \"State\" = 'Finished' WHERE \"Id\" = @case");

        var problems = await VerifyAsync();

        Assert.Contains(problems, p => p.Case == "(stored values)" && p.What.Contains("Table Cases", StringComparison.Ordinal)
            && p.What.Contains("column State", StringComparison.Ordinal) && p.What.Contains("'Finished'", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.Case == Candidate && p.What.Contains("cannot be loaded", StringComparison.Ordinal));
    }

    [Fact]
    public async Task A_stored_number_that_is_not_finite_is_named_by_the_repair_check()
    {
        await IntrudeAsync("UPDATE \"CaseArrivals\" SET \"Snr\" = {0} WHERE \"ReviewCaseId\" = @case AND \"SiteCode\" = 'KX'", double.PositiveInfinity);

        var problems = await VerifyAsync();

        Assert.Contains(problems, p => p.Case == "(stored values)" && p.What.Contains("Table CaseArrivals", StringComparison.Ordinal)
            && p.What.Contains("column Snr", StringComparison.Ordinal) && p.What.Contains("not a finite number", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.Case == Candidate && p.What.StartsWith("The arrival at KX is", StringComparison.Ordinal));
    }

    [Fact]
    public async Task A_sign_off_fingerprint_shorter_than_twelve_characters_is_reported_not_thrown()
    {
        await IntrudeAsync($"UPDATE \"SignOffs\" SET \"EvidenceFingerprint\" = 'abc' WHERE \"ChecklistItemId\" = {Item("alpha.two")}");

        await CaughtAsync(null, "sign-off by Reviewer Cy", "no signed entry accounts for it");
        Assert.Contains(await VerifyAsync(), p => p.What.Contains("given against evidence abc but", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Altering_the_bytes_of_an_attachment_on_disk_is_caught_in_both_cases_that_hold_it()
    {
        await File.WriteAllBytesAsync(Store.PathFor(Hashing.Sha256Hex("abc")), "abd"u8.ToArray());

        var (cases, _) = await new IntegrityVerifier(Factory, Store, Settings, Records).VerifyAsync();
        Assert.All(cases, c => Assert.Contains(c.Problems, p => p.Item == "alpha.one" && p.What.Contains("stored bytes of file 'plot.png'", StringComparison.Ordinal)));
    }
}
