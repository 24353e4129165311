using System.Net;
using System.Security.Claims;
using System.Text.Json;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;
using EventReview.Dossier;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Integrity;

/// <summary>
/// The record through the app's services: freezing a configuration (coordinators only), drift of later snapshots
/// ("concern" inside the freeze period, "drift" outside, "no drift"), stale sign-offs blocking closure, and the
/// dossier download that verifies offline and is reproducible.
/// </summary>
public sealed class RecordIntegrityTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private static readonly ClaimsPrincipal Coordinator = Principals.Coordinator("u-coord-t", "Coordinator Tess");
    private static readonly ClaimsPrincipal ReviewerA = Principals.Reviewer("u-rev-a", "Reviewer Ada");
    private static readonly ClaimsPrincipal ReviewerB = Principals.Reviewer("u-rev-b", "Reviewer Bo");
    private static readonly ClaimsPrincipal ReviewerC = Principals.Reviewer("u-rev-c", "Reviewer Cy");

    private const string FrozenText = "daq.firmware = 4.2.1\ncalibration.version = C07\nseal.rack3 = S-0042\n";
    private const string LaterText = "daq.firmware = 4.2.2\ncalibration.version = C07\nfilters.sha256 = 0f00\n";

    private T Get<T>() where T : notnull => app.Services.CreateScope().ServiceProvider.GetRequiredService<T>();

    private async Task<ReviewCase> OpenAsync(string checklist = "rapid-triage")
    {
        var gps = 1_400_000_000.125m;
        var request = new OpenCaseRequest(ApiCalls.NewCandidateId(), gps, "test-search", "Opened by a test.",
            [new ArrivalRequest("KP", gps + 0.004m, 9.5), new ArrivalRequest("AB", gps - 0.002m, 7.0)], checklist);
        return (await Get<CaseWorkflow>().OpenAsync(Coordinator, request)).Case;
    }

    private Task<ReviewCase> ReloadAsync(int id) => Get<CaseQueries>().GetAsync(Coordinator, id);

    /// <summary>Captures and freezes a KP snapshot over [now + fromHours, now + untilHours].</summary>
    private async Task<(ReviewCase Case, ConfigurationSnapshot Frozen)> FrozenCaseAsync(double fromHours, double untilHours)
    {
        var c = await OpenAsync();
        var config = Get<ConfigurationService>();
        var snapshot = await config.CaptureAsync(ReviewerA, c, "KP", "at the candidate", FrozenText, "kp.conf");
        var now = DateTimeOffset.UtcNow;
        c = await config.FreezeAsync(Coordinator, c, snapshot.Id, now.AddHours(fromHours), now.AddHours(untilHours), "Candidate under review.");
        var frozen = (await config.ListAsync(Coordinator, c)).Single(s => s.Id == snapshot.Id);
        return (c, frozen);
    }

    private static ComputationRecord LastConfigurationRecord(ReviewCase c) =>
        c.Items.Last(i => i.CheckKind == CheckKind.Configuration).Computations.OrderBy(r => r.Id).Last();

    [Fact]
    public async Task A_coordinator_freezes_a_snapshot_and_the_frozen_record_is_fingerprinted_on_the_case()
    {
        var (c, frozen) = await FrozenCaseAsync(-1, 24);

        Assert.True(frozen.IsFrozen);
        Assert.Equal(ConfigurationCanonical.Fingerprint(frozen), frozen.Fingerprint);
        var record = c.Items.First(i => i.CheckKind == CheckKind.Configuration).Computations.Single();
        Assert.Equal(("frozen", frozen.Fingerprint), (record.Verdict, record.InputFingerprint));
        Assert.Contains("KP configuration 'at the candidate' frozen (3 items)", record.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_reviewer_cannot_freeze_and_nothing_changes()
    {
        var c = await OpenAsync();
        var config = Get<ConfigurationService>();
        var snapshot = await config.CaptureAsync(ReviewerA, c, "KP", "at the candidate", FrozenText, "kp.conf");
        c = await ReloadAsync(c.Id);
        var now = DateTimeOffset.UtcNow;

        var ex = await Assert.ThrowsAsync<UnauthorizedAccessException>(() => config.FreezeAsync(ReviewerA, c, snapshot.Id, now.AddHours(-1), now.AddHours(1), "Trying."));

        Assert.Contains("freeze configuration records", ex.Message, StringComparison.Ordinal);
        var after = await ReloadAsync(c.Id);
        Assert.False((await config.ListAsync(Coordinator, after)).Single(s => s.Id == snapshot.Id).IsFrozen);
        Assert.Equal(c.Timeline.Count, after.Timeline.Count);
        Assert.Empty(after.Items.SelectMany(i => i.Computations));
    }

    [Fact]
    public async Task A_change_captured_inside_the_freeze_period_is_a_concern_with_the_diff()
    {
        var (c, frozen) = await FrozenCaseAsync(-1, 24);

        await Get<ConfigurationService>().CaptureAsync(ReviewerA, c, "KP", "weekly capture", LaterText, "kp-later.conf");

        var record = LastConfigurationRecord(await ReloadAsync(c.Id));
        Assert.Equal(DriftCheck.Concern, record.Verdict);
        Assert.Contains("CONCERN", record.Summary, StringComparison.Ordinal);
        using var result = JsonDocument.Parse(record.ResultJson);
        Assert.Equal(EventReview.Core.Verdicts.RecordFormat.Current, result.RootElement.GetProperty("format").GetInt32());
        var report = result.RootElement.GetProperty("report");
        var diff = report.GetProperty("diff");
        Assert.True(report.GetProperty("capturedDuringFreeze").GetBoolean());
        Assert.Equal("concern", report.GetProperty("judgement").GetProperty("verdict").GetString());
        Assert.Equal("filters.sha256", diff.GetProperty("added").EnumerateArray().Single().GetProperty("key").GetString());
        Assert.Equal("seal.rack3", diff.GetProperty("removed").EnumerateArray().Single().GetProperty("key").GetString());
        var changed = diff.GetProperty("changed").EnumerateArray().Single();
        Assert.Equal(("daq.firmware", "4.2.1", "4.2.2"), (changed.GetProperty("key").GetString(), changed.GetProperty("old").GetString(), changed.GetProperty("new").GetString()));
        Assert.Equal(1, diff.GetProperty("unchanged").GetInt32());
        Assert.Contains(frozen.Fingerprint!, record.ParametersJson, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_change_captured_after_the_freeze_period_is_drift_not_a_concern()
    {
        var (c, _) = await FrozenCaseAsync(-72, -48);

        await Get<ConfigurationService>().CaptureAsync(ReviewerA, c, "KP", "after the freeze", LaterText, "kp-later.conf");

        var record = LastConfigurationRecord(await ReloadAsync(c.Id));
        Assert.Equal(DriftCheck.Drift, record.Verdict);
        Assert.Contains("1 added, 1 removed, 1 changed, 1 unchanged", record.Summary, StringComparison.Ordinal);
        Assert.Contains("outside the freeze period", record.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_identical_later_snapshot_is_no_drift()
    {
        var (c, _) = await FrozenCaseAsync(-1, 24);

        await Get<ConfigurationService>().CaptureAsync(ReviewerA, c, "KP", "same again", FrozenText, "kp-again.conf");

        var after = await ReloadAsync(c.Id);
        var record = LastConfigurationRecord(after);
        Assert.Equal(DriftCheck.NoDrift, record.Verdict);
        Assert.Contains("no change from the frozen configuration (0 added, 0 removed, 0 changed, 3 unchanged)", record.Summary, StringComparison.Ordinal);
        var drift = Assert.Single(ConfigurationService.Drifts(after, await Get<ConfigurationService>().ListAsync(Coordinator, after)));
        Assert.Equal(DriftCheck.NoDrift, drift.Report.Verdict);
    }

    private async Task<ReviewCase> FullySignedAsync()
    {
        var c = await OpenAsync();
        var appender = Get<EvidenceAppender>();
        var workflow = Get<CaseWorkflow>();
        foreach (var item in c.Items.ToList())
        {
            await appender.AddNoteAsync(ReviewerA, c.Id, item.Key, $"Looked at {item.Key}.");
            c = await workflow.TransitionAsync(ReviewerA, c.Id, item.Key, "ready", null);
            c = await workflow.SignAsync(ReviewerB, c.Id, item.Key, SignOffMeaning.Reviewed, "Checked.", c.Item(item.Key).Fingerprint(), await Signers.ProofAsync(app.Services, ReviewerB));
            if (c.Item(item.Key).State != ItemState.SignedOff)
            {
                c = await workflow.SignAsync(ReviewerC, c.Id, item.Key, SignOffMeaning.Approved, "Agreed.", c.Item(item.Key).Fingerprint(), await Signers.ProofAsync(app.Services, ReviewerC));
            }
        }

        Assert.All(c.Items, i => Assert.Equal(ItemState.SignedOff, i.State));
        return c;
    }

    [Fact]
    public async Task Evidence_added_after_a_sign_off_makes_it_stale_and_blocks_closing_until_signed_again()
    {
        var c = await FullySignedAsync();
        var appender = Get<EvidenceAppender>();
        var workflow = Get<CaseWorkflow>();

        c = await appender.AddNoteAsync(ReviewerA, c.Id, "triage.timing", "A late correction.");
        var ex = await Assert.ThrowsAsync<DomainRuleException>(() => workflow.CloseAsync(Coordinator, c.Id, CaseOutcome.Inconclusive, "Not enough to decide."));

        Assert.Equal("stale-signoff", ex.Rule);
        Assert.Contains("triage.timing", ex.Message, StringComparison.Ordinal);
        var item = c.Item("triage.timing");
        Assert.Equal(ItemState.ReadyForSignOff, item.State);
        Assert.True(item.HasStaleSignOffs);
        Assert.NotEqual(item.Fingerprint(), item.SignOffs.Single().EvidenceFingerprint);
        Assert.NotEqual(CaseState.Closed, (await ReloadAsync(c.Id)).State);

        c = await workflow.SignAsync(ReviewerB, c.Id, "triage.timing", SignOffMeaning.Reviewed, "Read the correction.", item.Fingerprint(), await Signers.ProofAsync(app.Services, ReviewerB));
        c = await workflow.CloseAsync(Coordinator, c.Id, CaseOutcome.Inconclusive, "Not enough to decide.");

        Assert.Equal(CaseState.Closed, c.State);
        Assert.Empty(CaseIntegrity.Verify(await ReloadAsync(c.Id), Get<Data.AttachmentStore>().Verify, Get<EventReview.Core.Records.IRecordKeyRing>()));
    }

    private async Task<byte[]> DownloadAsync(int id)
    {
        var client = await app.As(Who.Observer);
        using var response = await client.GetAsync($"/cases/{id}/dossier.zip");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("application/zip", response.Content.Headers.ContentType?.MediaType);
        return await response.Content.ReadAsByteArrayAsync();
    }

    private static async Task<Dictionary<string, byte[]>> EntriesAsync(byte[] zip)
    {
        var problems = new List<Core.Dossier.DossierProblem>();
        var files = await DossierArchive.ReadAsync(new MemoryStream(zip), problems);
        Assert.Empty(problems);
        return files!;
    }

    [Fact]
    public async Task The_dossier_download_of_a_demo_case_verifies_offline()
    {
        var id = await (await app.As(Who.Observer)).CaseIdAsync("ER-C-0142");

        var zip = await DownloadAsync(id);

        var verification = await DossierArchive.VerifyAsync(new MemoryStream(zip), Get<Core.Records.IRecordKeyRing>().Keys);
        Assert.True(verification.Valid, string.Join("\n", verification.Problems) + " " + verification.Signature);
        Assert.Equal(Core.Dossier.DossierVerification.UnsignedWord, (await DossierArchive.VerifyAsync(new MemoryStream(zip))).Status); // without the server's key: never valid
        Assert.Contains("dossier.json", (await EntriesAsync(zip)).Keys);
    }

    [Fact]
    public async Task A_frozen_signed_then_altered_case_exports_a_dossier_that_verifies_and_shows_the_stale_sign_off_and_drift()
    {
        var (c, frozen) = await FrozenCaseAsync(-1, 24);
        var appender = Get<EvidenceAppender>();
        var workflow = Get<CaseWorkflow>();
        await appender.AddNoteAsync(ReviewerA, c.Id, "triage.timing", "Delay within the light time.");
        c = await workflow.TransitionAsync(ReviewerA, c.Id, "triage.timing", "ready", null);
        await workflow.SignAsync(ReviewerB, c.Id, "triage.timing", SignOffMeaning.Reviewed, "Checked.", c.Item("triage.timing").Fingerprint(), await Signers.ProofAsync(app.Services, ReviewerB));
        await appender.AddNoteAsync(ReviewerA, c.Id, "triage.timing", "A late correction.");
        await Get<ConfigurationService>().CaptureAsync(ReviewerA, c, "KP", "weekly capture", LaterText, "kp-later.conf");

        var zip = await DownloadAsync(c.Id);

        var verification = await DossierArchive.VerifyAsync(new MemoryStream(zip), Get<Core.Records.IRecordKeyRing>().Keys);
        Assert.True(verification.Valid, string.Join("\n", verification.Problems) + " " + verification.Signature);
        var json = System.Text.Encoding.UTF8.GetString((await EntriesAsync(zip))["dossier.json"]);
        Assert.Contains(frozen.Fingerprint!, json, StringComparison.Ordinal);
        Assert.Contains("\"isStale\": true", json.Replace("\"isStale\":true", "\"isStale\": true", StringComparison.Ordinal), StringComparison.Ordinal);
        Assert.Contains(DriftCheck.Concern, json, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Exporting_an_unchanged_case_twice_gives_identical_files_and_manifest_but_for_the_signature_value()
    {
        var c = await OpenAsync();
        await Get<EvidenceAppender>().AddNoteAsync(ReviewerA, c.Id, "triage.timing", "Delay within the light time.");
        await using (var s = new MemoryStream("gps,value\n1,2\n"u8.ToArray()))
        {
            await Get<EvidenceAppender>().AddAttachmentAsync(ReviewerA, c.Id, "triage.timing", s, "delays.csv", "text/csv", "Delay table", 1024);
        }

        var first = await EntriesAsync(await DownloadAsync(c.Id));
        var second = await EntriesAsync(await DownloadAsync(c.Id));

        Assert.Equal(first["dossier.json"], second["dossier.json"]);
        Assert.Equal(first.Keys.Order(), second.Keys.Order());
        Assert.All(first.Keys.Where(k => k != "manifest.json"), k => Assert.Equal(first[k], second[k]));
        var (a, b) = (Core.Dossier.DossierJson.Deserialize<Core.Dossier.DossierManifest>(first["manifest.json"]), Core.Dossier.DossierJson.Deserialize<Core.Dossier.DossierManifest>(second["manifest.json"]));
        Assert.Equal(a.SignedText(), b.SignedText()); // ECDSA signatures are randomised; what they sign is the same
        Assert.Equal(Get<Core.Records.IRecordKeyRing>().Current!.KeyId, a.Signature!.KeyFingerprint);
        await using var db = app.Db();
        var exports = await db.DossierExports.AsNoTracking().Where(e => e.ReviewCaseId == c.Id).ToListAsync();
        Assert.Equal(2, exports.Count);
        Assert.Single(exports.Select(e => e.ChainHead).Distinct());
    }

    [Fact]
    public async Task A_dossier_with_one_flipped_byte_in_dossier_json_is_invalid_and_names_the_file()
    {
        var id = await (await app.As(Who.Observer)).CaseIdAsync("ER-C-0142");
        var zip = await DownloadAsync(id);

        var (start, length) = EntryData(zip, "dossier.json");
        zip[start + (length / 2)] ^= 0x01;

        var verification = await DossierArchive.VerifyAsync(new MemoryStream(zip));
        Assert.False(verification.Valid);
        Assert.Contains(verification.Problems, p => p.File == "dossier.json");
    }

    /// <summary>Offset and length of an entry's stored (compressed) bytes, from its local file header (APPNOTE 4.3.7).</summary>
    private static (int Start, int Length) EntryData(byte[] zip, string name)
    {
        var nameBytes = System.Text.Encoding.UTF8.GetBytes(name);
        for (var at = 0; at + 30 < zip.Length; at++)
        {
            if (zip[at] != 0x50 || zip[at + 1] != 0x4b || zip[at + 2] != 0x03 || zip[at + 3] != 0x04)
            {
                continue;
            }

            var compressed = BitConverter.ToInt32(zip, at + 18);
            var nameLength = BitConverter.ToUInt16(zip, at + 26);
            var extraLength = BitConverter.ToUInt16(zip, at + 28);
            if (zip.AsSpan(at + 30, nameLength).SequenceEqual(nameBytes))
            {
                Assert.True(compressed > 0, "the entry's size is in its local header");
                return (at + 30 + nameLength + extraLength, compressed);
            }
        }

        throw new InvalidOperationException($"No local header for {name}.");
    }
}
