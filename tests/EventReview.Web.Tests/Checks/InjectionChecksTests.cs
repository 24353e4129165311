using System.Text;
using System.Text.Json;
using EventReview.Core.Cases;
using EventReview.Core.Injections;
using EventReview.Web.Demo;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Tests.Checks;

public sealed class InjectionChecksTests(LocalCausesHarness app) : IClassFixture<LocalCausesHarness>
{
    [Fact]
    public async Task Injection_log_lookup_is_clear_when_nothing_overlaps_and_lists_every_overlap_per_site_otherwise()
    {
        var c = await app.OpenCaseAsync("T-INJ-1", 1_400_000_100.5m, "candidate-review", ("KP", 0.0), ("AB", 0.006));
        var sites = new[] { "AB", "KP" };
        var quiet = await app.AttachAsync(c.Id, "injection.schedule", "log-quiet.csv", LocalCausesDemoFiles.InjectionLog(c.Gps, sites));
        var busy = await app.AttachAsync(c.Id, "injection.schedule", "log-busy.csv",
            "site,start_gps,end_gps,kind,waveform_ref,status\nAB,1400000095,1400000105,cbc,hw-9,performed\nKP,1400000108,1400000109,burst,hw-10,aborted\nKP,1400000200,1400000210,cbc,hw-11,scheduled\n");
        var service = app.Get<InjectionCheckService>();

        var (afterQuiet, added) = await service.RunLogAsync(app.Reviewer, c.Id, "injection.schedule", new InjectionCheckParameters(quiet));
        Assert.True(added);
        Assert.Equal("clear", Assert.Single(afterQuiet.Item("injection.schedule").Computations).Verdict);
        Assert.False((await service.RunLogAsync(app.Reviewer, c.Id, "injection.schedule", new InjectionCheckParameters(quiet))).Added);

        var (afterBusy, _) = await service.RunLogAsync(app.Reviewer, c.Id, "injection.schedule", new InjectionCheckParameters(busy, 10));
        var record = afterBusy.Item("injection.schedule").Computations.OrderByDescending(r => r.Id).First();
        Assert.Equal("concern", record.Verdict);
        var result = JsonSerializer.Deserialize<InjectionRecordResult>(record.ResultJson, CheckRecords.Json)!;
        Assert.Equal("log", result.Source);
        // AB arrival 1400000100.506 lies inside [95, 105]; KP arrival 100.5 is 7.5 s before the aborted one (within 10 s); the scheduled one is 99.5 s away
        Assert.Equal(["AB:performed:0", "KP:aborted:-7.5"], result.Report.Hits.Select(h => $"{h.Site}:{h.Status}:{Math.Round(h.OffsetSeconds, 3)}"));
        Assert.Contains("2 overlap(s)", record.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_malformed_injection_log_names_the_file_and_line_and_stores_nothing()
    {
        var c = await app.OpenCaseAsync("T-INJ-2", 1_400_000_200m, "rapid-triage", ("KP", 0.0), ("AB", 0.006));
        var bad = await app.AttachAsync(c.Id, "triage.injections", "log-bad.csv", "site,start_gps,end_gps,kind,waveform_ref,status\nAB,10,20,cbc,w,performed\nAB,30,40,cbc,w,finished\n");
        var ex = await Assert.ThrowsAsync<FormatException>(() => app.Get<InjectionCheckService>().RunLogAsync(app.Reviewer, c.Id, "triage.injections", new InjectionCheckParameters(bad)));
        Assert.Contains("'log-bad.csv'", ex.Message, StringComparison.Ordinal);
        Assert.Contains("line 3", ex.Message, StringComparison.Ordinal);
        Assert.Empty((await app.Get<CaseQueries>().GetAsync(app.Reviewer, c.Id)).Item("triage.injections").Computations);
    }

    [Fact]
    public async Task Sealed_record_register_refuse_wrong_salt_open_with_right_salt_and_block_astrophysical_closing_until_opened()
    {
        var c = await app.OpenCaseAsync("T-SEAL-1", 1_400_000_300m, "candidate-review", ("KP", 0.0), ("AB", 0.006), ("SM", 0.004));
        var seals = app.Get<SealedRecordService>();
        var record = Encoding.UTF8.GetBytes("site,start_gps,end_gps,kind,waveform_ref,status\nAB,1400000295,1400000305,cbc,blind-3,performed");
        var sealResult = SealedRecord.Seal(record);

        await Assert.ThrowsAsync<UnauthorizedAccessException>(() => seals.RegisterAsync(app.Reviewer, sealResult.Commitment, "by a reviewer"));
        var seal = await seals.RegisterAsync(app.Coordinator, sealResult.Commitment, "Test period", c.Id, "injection.blind-seal");
        await Assert.ThrowsAsync<ArgumentException>(() => seals.RegisterAsync(app.Coordinator, sealResult.Commitment, "again"));
        Assert.Single((await app.Get<CaseQueries>().GetAsync(app.Reviewer, c.Id)).Item("injection.blind-seal").Evidence);

        Assert.True(await seals.AnyUnopenedAsync());
        var refused = await Assert.ThrowsAsync<DomainRuleException>(() => seals.EnsureMayCloseAsync(c, CaseOutcome.Astrophysical));
        Assert.Equal("sealed-record-unopened", refused.Rule);
        await seals.EnsureMayCloseAsync(c, CaseOutcome.Instrumental); // other outcomes are not blocked

        // Nothing of sections 2-6 is signed: opening is refused unless a coordinator writes why (the reason goes into the timeline).
        var early = await Assert.ThrowsAsync<DomainRuleException>(() => seals.OpenAsync(app.Coordinator, seal.Id, c.Id, "injection.blind-open", record, sealResult.Salt));
        Assert.Equal("sections-unsigned", early.Rule);
        Assert.Contains("state.observing-mode", early.Message, StringComparison.Ordinal);
        Assert.False((await seals.ListAsync()).Single(s => s.Id == seal.Id).IsOpened);
        const string why = "Test of the opening path: opened before the review is complete, on purpose.";

        var wrongSalt = new string(sealResult.Salt.Select(ch => ch == '0' ? '1' : '0').ToArray());
        var mismatch = await Assert.ThrowsAsync<DomainRuleException>(() => seals.OpenAsync(app.Coordinator, seal.Id, c.Id, "injection.blind-open", record, wrongSalt, overrideReason: why));
        Assert.Equal("commitment-mismatch", mismatch.Rule);
        Assert.Equal(SealedRecordService.MismatchMessage, mismatch.Message);
        Assert.False((await seals.ListAsync()).Single(s => s.Id == seal.Id).IsOpened);
        Assert.Empty((await app.Get<CaseQueries>().GetAsync(app.Reviewer, c.Id)).Item("injection.blind-open").Computations);
        await Assert.ThrowsAsync<UnauthorizedAccessException>(() => seals.OpenAsync(app.Reviewer, seal.Id, c.Id, "injection.blind-open", record, sealResult.Salt));

        var opened = await seals.OpenAsync(app.Coordinator, seal.Id, c.Id, "injection.blind-open", record, sealResult.Salt, overrideReason: why);

        var stored = Assert.Single(opened.Item("injection.blind-open").Computations);
        Assert.Equal("concern", stored.Verdict); // the blind injection at AB spans the AB arrival
        var result = JsonSerializer.Deserialize<InjectionRecordResult>(stored.ResultJson, CheckRecords.Json)!;
        Assert.Equal("sealed-record", result.Source);
        Assert.Equal(sealResult.Commitment, result.Seal!.Commitment);
        Assert.Equal("AB", Assert.Single(result.Report.Hits).Site);
        Assert.Contains(opened.Timeline, a => a.ItemKey == "injection.blind-open" && a.Kind == "computation.injections");
        Assert.Contains(opened.Timeline, a => a.ItemKey == "injection.blind-open" && a.Kind == "override" && a.Text.Contains(why, StringComparison.Ordinal));
        var after = (await seals.ListAsync()).Single(s => s.Id == seal.Id);
        Assert.True(after.IsOpened);
        Assert.Equal(c.Id, after.OpenedInCaseId);
        Assert.Equal(record, after.OpenedRecord);
        // Opened: the old rule let this case close as astrophysical; its arrivals fall on the blind injection, so it may not.
        var overlap = await Assert.ThrowsAsync<DomainRuleException>(() => seals.EnsureMayCloseAsync(c, CaseOutcome.Astrophysical));
        Assert.Equal("blind-injection-overlap", overlap.Rule);
        Assert.Contains("blind-3", overlap.Message, StringComparison.Ordinal);
        await seals.EnsureMayCloseAsync(c, CaseOutcome.Injection);
        var far = await app.OpenCaseAsync("T-SEAL-2", 1_400_100_300m, "candidate-review", ("KP", 0.0), ("AB", 0.006));
        Assert.True((await seals.DecideClosingAsync(far, CaseOutcome.Astrophysical)).Allowed); // both rules agree: opened, nothing near
        var twice = await Assert.ThrowsAsync<DomainRuleException>(() => seals.OpenAsync(app.Coordinator, seal.Id, c.Id, "injection.blind-open", record, sealResult.Salt, overrideReason: why));
        Assert.Equal("seal-already-opened", twice.Rule);

        var compared = await seals.CompareWithOpenedAsync(app.Reviewer, seal.Id, c.Id, "injection.blind-seal");
        Assert.Equal("concern", Assert.Single(compared.Item("injection.blind-seal").Computations).Verdict);
    }
}
