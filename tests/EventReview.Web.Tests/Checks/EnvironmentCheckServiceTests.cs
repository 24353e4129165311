using System.Text.Json;
using EventReview.Core.Verdicts;
using EventReview.Web.Demo;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Tests.Checks;

public sealed class EnvironmentCheckServiceTests(LocalCausesHarness app) : IClassFixture<LocalCausesHarness>
{
    private async Task<(int CaseId, EnvironmentCheckParameters Parameters)> CaseWithDemoFilesAsync(string id, string? disturbed)
    {
        var c = await app.OpenCaseAsync(id, 1_400_000_000.25m, "candidate-review", ("KP", 0.0), ("AB", 0.006), ("SM", 0.004));
        var arrivals = c.Arrivals.ToDictionary(a => a.SiteCode, a => a.Arrival);
        var sites = arrivals.Keys.Order().ToList();
        var seg = await app.AttachAsync(c.Id, "state.dq-segments", "dq-segments.csv", LocalCausesDemoFiles.Segments(c.Gps, sites));
        var trig = await app.AttachAsync(c.Id, "env.triggers", "triggers.csv", LocalCausesDemoFiles.Triggers(c.Gps, arrivals, disturbed, 7));
        var inv = await app.AttachAsync(c.Id, "env.triggers", "inventory.csv", LocalCausesDemoFiles.Inventory(sites, "AB"));
        await app.AttachAsync(c.Id, "env.coupling", LocalCausesDemoFiles.CouplingFileName("AB"), LocalCausesDemoFiles.MagneticCoupling());
        var log = await app.AttachAsync(c.Id, "injection.system-records", "injection-log.csv", LocalCausesDemoFiles.InjectionLog(c.Gps, sites));
        return (c.Id, LocalCausesDemoStep.DemoEnvironmentParameters(seg, trig, inv, log));
    }

    [Fact]
    public async Task Environment_check_on_demo_like_files_is_of_concern_at_the_disturbed_site_only_and_a_rerun_adds_nothing()
    {
        var (caseId, p) = await CaseWithDemoFilesAsync("T-ENV-1", "AB");
        var service = app.Get<EnvironmentCheckService>();

        var (c, added) = await service.RunAsync(app.Reviewer, caseId, "env.triggers", p);

        Assert.True(added);
        var record = Assert.Single(c.Item("env.triggers").Computations);
        Assert.Equal("concern", record.Verdict);
        var result = JsonSerializer.Deserialize<EnvironmentRecordResult>(record.ResultJson, CheckRecords.Json)!;
        Assert.Equal(["AB:concern", "KP:clear", "SM:clear"], result.Report.Sites.Select(s => $"{s.Site}:{s.Judgement.Word}"));
        Assert.All(result.Report.Hits, h => Assert.Equal("AB", h.Site));
        var mag = Assert.Single(result.Report.Hits, h => h.Channel == "AB/" + LocalCausesDemoFiles.Magnetometer);
        Assert.Equal(-0.182, mag.OffsetSeconds, 6);
        Assert.Equal("magnetic", mag.Kind);
        // Poisson chance of at least one trigger in ±w at rate R: 1 - exp(-2 w R) (from memory)
        Assert.Equal(1 - Math.Exp(-2 * 1.0 * mag.ChannelRateHz), mag.ChanceProbability, 12);
        // coupling 1.2e-13 strain/T at 75 Hz (tabulated) x SNR 23.5 x 10 pT / 1e-21 = 0.0282 (hand calculation)
        Assert.Equal(0.0282, mag.CouplingRatio!.Value, 6);
        Assert.False(mag.CouplingFlagged);
        Assert.Equal("candidate strain: typed; sensor amplitude: typed", mag.CouplingInputs);
        Assert.All(result.Safety!.Channels.Where(ch => ch.Channel.EndsWith("inst/actuator-readback", StringComparison.Ordinal)), ch =>
        {
            // the actuator readback fires at all 5 injections: binomial P = q^5 with q from its rate away from the injections
            Assert.False(ch.Safe);
            Assert.Equal(5, ch.Coincident);
            Assert.Equal(Math.Pow(ch.ChanceProbabilityPerInjection, 5), ch.BinomialProbability, 1e-20);
            Assert.True(ch.DeadtimeSeconds > 0);
        });
        Assert.Equal(RecordFormat.Current, result.Format);
        Assert.Contains(result.Files, f => f.FileName == LocalCausesDemoFiles.CouplingFileName("AB"));
        Assert.Contains("<svg", record.PicturesSvg, StringComparison.Ordinal);

        var (again, addedAgain) = await service.RunAsync(app.Reviewer, caseId, "env.triggers", p);
        Assert.False(addedAgain);
        Assert.Single(again.Item("env.triggers").Computations);
    }

    [Fact]
    public async Task Environment_check_with_nothing_near_the_candidate_is_clear()
    {
        var (caseId, p) = await CaseWithDemoFilesAsync("T-ENV-2", null);

        var (c, _) = await app.Get<EnvironmentCheckService>().RunAsync(app.Reviewer, caseId, "env.triggers", p);

        var record = Assert.Single(c.Item("env.triggers").Computations);
        Assert.Equal("clear", record.Verdict);
        var result = JsonSerializer.Deserialize<EnvironmentRecordResult>(record.ResultJson, CheckRecords.Json)!;
        Assert.Empty(result.Report.Hits);
        Assert.Empty(result.Report.Segments);
        Assert.All(result.Report.Sites, s => Assert.Equal("clear", s.Judgement.Word));
    }

    [Fact]
    public async Task A_malformed_triggers_file_is_refused_naming_the_file_and_line_and_nothing_is_stored()
    {
        var (caseId, p) = await CaseWithDemoFilesAsync("T-ENV-3", "AB");
        var bad = await app.AttachAsync(caseId, "env.triggers", "bad-triggers.csv",
            "site,channel,gps_time,snr\nAB,AB/env/magnetometer-electronics-vault/x,1400000000.1,12\nAB,AB/env/magnetometer-electronics-vault/x,1400000001.1,NaN\n");

        var ex = await Assert.ThrowsAsync<FormatException>(() => app.Get<EnvironmentCheckService>().RunAsync(app.Reviewer, caseId, "env.triggers", p with { TriggersSha = bad }));

        Assert.Contains("'bad-triggers.csv'", ex.Message, StringComparison.Ordinal);
        Assert.Contains("line 3", ex.Message, StringComparison.Ordinal);
        var c = await app.Get<CaseQueries>().GetAsync(app.Reviewer, caseId);
        Assert.Empty(c.Item("env.triggers").Computations);
    }

    [Fact]
    public async Task A_missing_pick_is_refused_before_anything_is_read()
    {
        var (caseId, p) = await CaseWithDemoFilesAsync("T-ENV-4", null);
        var ex = await Assert.ThrowsAsync<ArgumentException>(() => app.Get<EnvironmentCheckService>().RunAsync(app.Reviewer, caseId, "env.triggers", p with { SegmentsSha = null }));
        Assert.Contains("data-quality segments", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Kind_windows_parse_from_text_and_bad_entries_are_named()
    {
        Assert.Equal(10, EnvironmentCheckParameters.ParseKindWindows("Seismic=10, weather = 5")!["seismic"]);
        Assert.Null(EnvironmentCheckParameters.ParseKindWindows(" "));
        var ex = Assert.Throws<ArgumentException>(() => EnvironmentCheckParameters.ParseKindWindows("seismic:10"));
        Assert.Contains("seismic:10", ex.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentException>(() => new EnvironmentCheckParameters("a", "b", WindowSecondsByKind: new Dictionary<string, double> { ["volcanic"] = 1 }).Validate());
    }
}
