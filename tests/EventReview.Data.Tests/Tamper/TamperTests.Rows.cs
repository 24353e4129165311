using EventReview.Core.Evidence;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests.Tamper;

/// <summary>Changes to the rows a case's timeline accounts for: the case, arrivals, items, evidence, computations, sign-offs, frozen configuration.</summary>
public abstract partial class TamperTests
{
    [Fact]
    public async Task A_case_set_to_closed_as_astrophysical_by_hand_is_caught()
    {
        await IntrudeAsync("UPDATE \"Cases\" SET \"State\" = 'Closed', \"Outcome\" = 'Astrophysical', \"ClosingStatement\" = 'Confirmed.' WHERE \"Id\" = @case");

        var p = await CaughtAsync(null, "The case's state is 'closed' in the database, but the signed record says 'in review'");
        Assert.NotNull(p.Entry);
        await CaughtAsync(null, "The case's outcome is 'astrophysical' in the database, but the signed record says (none)");
    }

    [Fact]
    public async Task A_changed_gps_time_or_candidate_id_is_caught()
    {
        await IntrudeAsync("UPDATE \"Cases\" SET \"GpsNanoseconds\" = \"GpsNanoseconds\" + 1000000 WHERE \"Id\" = @case");

        await CaughtAsync(null, "The case's GPS time (ns) is", "but the signed record says", "(entry 1)");
    }

    [Fact]
    public async Task A_renamed_candidate_is_caught()
    {
        await IntrudeAsync("UPDATE \"Cases\" SET \"CandidateId\" = 'TC-RENAMED' WHERE \"Id\" = @case");

        var problems = await VerifyAsync();
        Assert.Contains(problems, p => p.Case == "TC-RENAMED" && p.What.Contains("candidate id is 'TC-RENAMED' in the database", StringComparison.Ordinal));
    }

    [Fact]
    public async Task A_moved_last_change_time_is_caught()
    {
        await IntrudeAsync("UPDATE \"Cases\" SET \"UpdatedAt\" = {0} WHERE \"Id\" = @case", Stored(SampleCases.T0.AddDays(30)));

        await CaughtAsync(null, "last-change time is", "but its newest entry");
    }

    [Fact]
    public async Task A_moved_arrival_time_is_caught()
    {
        await IntrudeAsync("UPDATE \"CaseArrivals\" SET \"ArrivalNanoseconds\" = \"ArrivalNanoseconds\" + 4000000 WHERE \"ReviewCaseId\" = @case AND \"SiteCode\" = 'KX'");

        await CaughtAsync(null, "The arrival at KX is", "in the database, but the signed record says", "(entry 1)");
    }

    [Fact]
    public async Task A_deleted_and_an_added_arrival_are_caught()
    {
        await IntrudeAsync("DELETE FROM \"CaseArrivals\" WHERE \"ReviewCaseId\" = @case AND \"SiteCode\" = 'MV'");
        await IntrudeAsync("INSERT INTO \"CaseArrivals\" (\"ReviewCaseId\", \"SiteCode\", \"ArrivalNanoseconds\", \"Snr\") VALUES (@case, 'QZ', 1400000000123456789, 30.0)");

        await CaughtAsync(null, "The arrival at MV, recorded in entry 1, is missing from the database");
        await CaughtAsync(null, "The arrival at QZ is in the database, but no signed entry accounts for it");
    }

    [Fact]
    public async Task An_item_set_to_signed_off_is_caught()
    {
        await IntrudeAsync("UPDATE \"ChecklistItems\" SET \"State\" = 'SignedOff' WHERE \"ReviewCaseId\" = @case AND \"Key\" = 'alpha.two'");

        var p = await CaughtAsync(null, "Item 'alpha.two': its state is 'signed off' in the database, but the signed record says 'ready for sign-off'");
        Assert.Equal("alpha.two", p.Item);
    }

    [Fact]
    public async Task Fewer_required_sign_offs_a_new_owner_or_due_date_are_caught()
    {
        await IntrudeAsync("UPDATE \"ChecklistItems\" SET \"RequiredSignOffs\" = 1, \"OwnerId\" = 'u-rev-c', \"OwnerName\" = 'Reviewer Cy', \"DueDate\" = '2027-01-01' WHERE \"ReviewCaseId\" = @case AND \"Key\" = 'alpha.two'");

        await CaughtAsync(null, "Item 'alpha.two': its required sign-offs is '1' in the database, but the signed record says '2'");
        await CaughtAsync(null, "Item 'alpha.two': its owner name is 'Reviewer Cy'");
        await CaughtAsync(null, "Item 'alpha.two': its due date is '2027-01-01'");
    }

    [Fact]
    public async Task An_inserted_item_is_unaccounted()
    {
        await IntrudeAsync("INSERT INTO \"ChecklistItems\" (\"ReviewCaseId\", \"Key\", \"SectionKey\", \"SectionTitle\", \"SectionOrder\", \"Order\", \"Title\", \"Guidance\", \"State\", \"RequiredSignOffs\", \"OwnerMaySign\", \"Version\") " +
            "VALUES (@case, 'gamma.one', 'gamma', 'Gamma', 3, 1, 'Extra', 'None.', 'SignedOff', 1, {0}, 0)", false);

        await CaughtAsync(null, "Item 'gamma.one' is in the database, but no signed entry accounts for it");
    }

    [Fact]
    public async Task A_deleted_note_is_reported_missing()
    {
        await IntrudeAsync($"DELETE FROM \"Evidence\" WHERE \"ChecklistItemId\" = {Item("alpha.one")} AND \"Text\" = 'Late addendum.'");

        var p = await CaughtAsync(null, "The note recorded in entry", "(Reviewer Ada,", "is missing from the database");
        Assert.Equal("alpha.one", p.Item);
    }

    [Fact]
    public async Task A_note_rewritten_with_its_hash_is_caught_as_missing_and_unaccounted()
    {
        var forged = "Nothing to see here.";
        await IntrudeAsync($"UPDATE \"Evidence\" SET \"Text\" = {{0}}, \"ContentSha256\" = {{1}} WHERE \"ChecklistItemId\" = {Item("alpha.one")} AND \"Text\" = 'First **note**.'", forged, Hashing.Sha256Hex(forged));

        await CaughtAsync(null, "The note recorded in entry", "is missing from the database");
        await CaughtAsync(null, "The note added by Reviewer Ada", "is in the database, but no signed entry accounts for it");
        Assert.DoesNotContain(await VerifyAsync(), p => p.What.Contains("text no longer matches", StringComparison.Ordinal));
    }

    [Fact]
    public async Task A_changed_link_title_or_file_description_is_caught()
    {
        await IntrudeAsync($"UPDATE \"Evidence\" SET \"Text\" = 'A different plot' WHERE \"ChecklistItemId\" = {Item("alpha.one")} AND \"Kind\" = 'Attachment'");

        await CaughtAsync(null, "The file 'plot.png' added by Reviewer Ada", "its text or content type was changed after entry");
    }

    [Fact]
    public async Task A_file_given_another_role_by_hand_is_caught()
    {
        // The role decides which check may read the file, so it is part of the row's seal: a segments list relabelled as
        // strain would otherwise feed the overlap check unnoticed.
        await IntrudeAsync($"UPDATE \"Evidence\" SET \"Role\" = 'strain:KX' WHERE \"ChecklistItemId\" = {Item("alpha.one")} AND \"Kind\" = 'Attachment'");

        await CaughtAsync(null, "The file 'plot.png' added by Reviewer Ada", "no signed entry accounts for it");
    }

    [Fact]
    public async Task A_forged_evidence_row_is_unaccounted_even_when_its_hash_is_right()
    {
        var text = "All checks passed (added later).";
        await IntrudeAsync("INSERT INTO \"Evidence\" (\"ChecklistItemId\", \"Kind\", \"Text\", \"ContentSha256\", \"AddedBy\", \"AddedByName\", \"AddedAt\") " +
            $"VALUES ({Item("alpha.one")}, 'Note', {{0}}, {{1}}, 'u-rev-a', 'Reviewer Ada', {{2}})", text, Hashing.Sha256Hex(text), Stored(SampleCases.T0.AddMinutes(3)));

        await CaughtAsync(null, "The note added by Reviewer Ada", "no signed entry accounts for it (inserted, or altered after it was recorded)");
    }

    [Fact]
    public async Task A_deleted_computation_record_is_reported_missing()
    {
        await IntrudeAsync($"DELETE FROM \"Computations\" WHERE \"ChecklistItemId\" = {Item("beta.one")} AND \"Kind\" = 'timing'");

        await CaughtAsync(null, "The 'timing' computation record recorded in entry", "is missing from the database");
    }

    [Fact]
    public async Task A_changed_verdict_is_caught()
    {
        await IntrudeAsync($"UPDATE \"Computations\" SET \"Verdict\" = 'inconsistent' WHERE \"ChecklistItemId\" = {Item("beta.one")} AND \"Kind\" = 'timing'");

        await CaughtAsync(null, "'timing' computation record run by Reviewer Ada", "no signed entry accounts for it");
    }

    [Fact]
    public async Task A_deleted_sign_off_is_reported_missing()
    {
        await IntrudeAsync($"DELETE FROM \"SignOffs\" WHERE \"ChecklistItemId\" = {Item("alpha.two")}");

        var p = await CaughtAsync(null, "The sign-off recorded in entry", "(Reviewer Cy,", "is missing from the database");
        Assert.Equal("alpha.two", p.Item);
    }

    [Fact]
    public async Task A_moved_sign_off_time_is_caught()
    {
        await IntrudeAsync($"UPDATE \"SignOffs\" SET \"SignedAtUtc\" = {{0}} WHERE \"ChecklistItemId\" = {Item("alpha.two")}", Stored(SampleCases.T0.AddHours(-10)));

        await CaughtAsync(null, "The sign-off by Reviewer Cy", "no signed entry accounts for it (inserted, or its signer, time, statement, meaning or fingerprint altered)");
    }

    [Fact]
    public async Task A_forged_sign_off_is_unaccounted()
    {
        await IntrudeAsync("INSERT INTO \"SignOffs\" (\"ChecklistItemId\", \"UserId\", \"SignerName\", \"SignedAtUtc\", \"SignedAtGpsNanoseconds\", \"Meaning\", \"Statement\", \"EvidenceFingerprint\", \"IsStale\") " +
            $"SELECT \"ChecklistItemId\", 'u-coord', 'Coordinator Cole', \"SignedAtUtc\", \"SignedAtGpsNanoseconds\", 'Approved', 'Fine.', \"EvidenceFingerprint\", \"IsStale\" FROM \"SignOffs\" WHERE \"ChecklistItemId\" = {Item("alpha.two")}");

        await CaughtAsync(null, "The sign-off by Coordinator Cole", "no signed entry accounts for it");
    }

    [Fact]
    public async Task A_stale_mark_with_no_timeline_entry_is_caught()
    {
        await IntrudeAsync($"UPDATE \"SignOffs\" SET \"IsStale\" = {{0}}, \"StaleSince\" = {{1}} WHERE \"ChecklistItemId\" = {Item("alpha.two")}", true, Stored(SampleCases.T0.AddHours(3)));

        await CaughtAsync(null, "The sign-off by Reviewer Cy", "is marked stale in the database, but the signed record has no stale mark for it");
    }

    [Fact]
    public async Task A_removed_stale_mark_is_caught()
    {
        await IntrudeAsync($"UPDATE \"SignOffs\" SET \"IsStale\" = {{0}}, \"StaleSince\" = NULL WHERE \"ChecklistItemId\" = {Item("alpha.one")} AND \"IsStale\" = {{1}}", false, true);

        await CaughtAsync(null, "The sign-off by Reviewer Bo", "was made stale in entry", "but the database shows it current");
    }

    [Fact]
    public async Task An_edited_frozen_configuration_is_caught()
    {
        await IntrudeAsync($"UPDATE \"ConfigurationSnapshots\" SET \"ItemsJson\" = {{0}} WHERE \"Id\" = {FrozenId}", "{\"calibration.version\":\"v18\",\"daq.firmware\":\"4.2.1\"}");

        await CaughtAsync(null, $"The frozen configuration record {FrozenId} of KX was altered after entry", "now give fingerprint");
    }

    [Fact]
    public async Task An_unfrozen_configuration_is_caught()
    {
        await IntrudeAsync($"UPDATE \"ConfigurationSnapshots\" SET \"IsFrozen\" = {{0}} WHERE \"Id\" = {FrozenId}", false);

        await CaughtAsync(null, $"The configuration record {FrozenId} of KX, frozen in entry", "is no longer marked frozen in the database");
    }

    [Fact]
    public async Task A_deleted_frozen_configuration_is_reported_missing()
    {
        await IntrudeAsync($"DELETE FROM \"ConfigurationSnapshots\" WHERE \"Id\" = {FrozenId}");

        await CaughtAsync(null, $"The configuration record {FrozenId}, frozen in entry", "is missing from the database");
    }

    [Fact]
    public async Task A_capture_marked_frozen_by_hand_is_unaccounted()
    {
        await IntrudeAsync($"UPDATE \"ConfigurationSnapshots\" SET \"IsFrozen\" = {{0}}, \"Fingerprint\" = {{1}} WHERE \"Id\" = {CaptureId}", true, new string('a', 64));

        await CaughtAsync(null, $"The configuration record {CaptureId} of KX is marked frozen for this case, but no signed entry records the freeze");
    }
}
