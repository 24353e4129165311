using System.Text;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Significance;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;
using EventReview.Web.Demo;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Checks;

public sealed class BackgroundCheckServiceTests(BackgroundAppFactory app) : IClassFixture<BackgroundAppFactory>
{
    private const string Item = BackgroundDemoStep.ItemKey;

    [Fact]
    public async Task Demo_record_holds_the_same_figures_as_the_core_run_on_the_same_files()
    {
        using var scope = app.Services.CreateScope();
        var c = await Case(scope, "ER-C-0142");
        var record = Latest(c, Item)!;
        var stored = Read(record);
        var files = scope.ServiceProvider.GetRequiredService<CaseFiles>();

        var check = stored.Check;
        Assert.Equal(RecordFormat.Current, stored.Format);
        Assert.Equal(3, check.Pairs.Count);
        Assert.Equal(record.Verdict, check.Judgement.Word);
        Assert.Contains(record.Verdict, new[] { "below 3 sigma", "3 to 5 sigma", "5 sigma or more", "at least 3 sigma", "concern" });
        Assert.DoesNotContain("consistent", record.Summary, StringComparison.Ordinal);

        // three sites: the triple (a window per pair) and the joint figure, which sums the types' rates at the triple's statistic
        var triple = Assert.IsType<TripleBackgroundResult>(check.Triple);
        var joint = Assert.IsType<JointSignificanceResult>(check.Joint);
        Assert.Equal(check.Pairs.Select(p => p.Plan.WindowMs).OrderBy(w => w), triple.WindowsMs.OrderBy(w => w));
        Assert.Equal(Math.Sqrt(c.Arrivals.Sum(a => a.Snr * a.Snr)), triple.CandidateStatistic, 1e-3);
        var sum = check.Pairs.Sum(p => (p.Result.LouderThanJoint == 0 ? 2.302585092994046 : p.Result.LouderThanJoint) / p.Result.BackgroundSeconds)
            + ((triple.Figures.Louder == 0 ? 2.302585092994046 : triple.Figures.Louder) / triple.BackgroundSeconds);
        Assert.Equal(sum, joint.Figures.FarHz, 1e-20);
        Assert.Equal(joint.Judgement.Verdict, check.Judgement.Verdict);
        foreach (var p in check.Pairs)
        {
            var a = await Site(files, stored.Sites.Single(s => s.SiteCode == p.Plan.SiteA));
            var b = await Site(files, stored.Sites.Single(s => s.SiteCode == p.Plan.SiteB));
            var arrivalA = c.Arrivals.Single(x => x.SiteCode == p.Plan.SiteA);
            var arrivalB = c.Arrivals.Single(x => x.SiteCode == p.Plan.SiteB);

            // default candidate statistic: network SNR of the pair's arrivals (rounded to 1e-3 in the plan)
            Assert.Equal(Math.Sqrt((arrivalA.Snr * arrivalA.Snr) + (arrivalB.Snr * arrivalB.Snr)), p.Plan.CandidateStatistic!.Value, 1e-3);

            // the same options written out by hand: window from the plan, step 5 s, the demo's K, candidate near site A's arrival
            var options = TimeSlideOptions.Create(p.Plan.WindowMs, 5.0, BackgroundDemoStep.SlidesK) with
            {
                CandidateStatistic = p.Plan.CandidateStatistic!.Value,
                RemoveCandidateTriggers = true,
                CandidateTime = arrivalA.Arrival,
                LoudestCount = 20,
            };
            var direct = TimeSlideBackground.Run(a, b, options);

            Assert.Equal(direct.FarHz, p.Result.FarHz);
            Assert.Equal(direct.FarIsBound, p.Result.FarIsBound);
            Assert.Equal(direct.Fap, p.Result.Fap);
            Assert.Equal(direct.Sigma, p.Result.Sigma);
            Assert.Equal(direct.Louder, p.Result.Louder);
            Assert.Equal(direct.BackgroundCoincidences, p.Result.BackgroundCoincidences);
            Assert.Equal(direct.BackgroundSeconds, p.Result.BackgroundSeconds);
            Assert.Equal(direct.WithoutCandidateTriggers, p.Result.WithoutCandidateTriggers);
            Assert.Equal(direct.SlidePValue, p.Result.SlidePValue);
            Assert.Equal(2 * BackgroundDemoStep.SlidesK, p.Result.Slides);
            Assert.True(p.Result.Curve.Count <= BackgroundCheckService.CurvePointsKept);

            // the candidate's own coincident triggers were found at zero lag, at the arrivals
            Assert.Equal(arrivalA.ArrivalNanoseconds, p.Result.Candidate!.TimeANs);
            Assert.Equal(arrivalB.ArrivalNanoseconds, p.Result.Candidate.TimeBNs);
        }

        var pictures = record.PicturesSvg.Split(CheckRecords.PictureSeparator);
        Assert.Equal(3, pictures.Length);
        Assert.All(pictures, s => Assert.StartsWith("<svg", s, StringComparison.Ordinal));
        Assert.Contains("FAR", record.Summary, StringComparison.Ordinal);
        Assert.Contains("per year", record.Summary, StringComparison.Ordinal);
        Assert.Contains("10,000 slides", record.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Rerun_with_the_same_files_and_parameters_adds_nothing()
    {
        using var scope = app.Services.CreateScope();
        var c = await Case(scope, "ER-C-0142");
        var before = c.Item(Item).Computations.Count;
        var stored = Read(Latest(c, Item)!);
        var parameters = new BackgroundCheckParameters([.. stored.Sites.Select(s => new BackgroundSiteFiles(s.SiteCode, s.TriggersSha256, s.SegmentsSha256))], SlidesK: BackgroundDemoStep.SlidesK);

        var (updated, added, _) = await Service(scope).RunAsync(BackgroundAppFactory.Reviewer, c.Id, Item, parameters);

        Assert.False(added);
        Assert.Equal(before, updated.Item(Item).Computations.Count);
    }

    [Fact]
    public async Task A_step_not_much_longer_than_the_window_is_refused_with_a_message()
    {
        using var scope = app.Services.CreateScope();
        var c = await Case(scope, "ER-C-0142");
        var before = c.Item(Item).Computations.Count;
        var stored = Read(Latest(c, Item)!);
        var parameters = new BackgroundCheckParameters([.. stored.Sites.Select(s => new BackgroundSiteFiles(s.SiteCode, s.TriggersSha256, s.SegmentsSha256))], StepSeconds: 0.015);

        var ex = await Assert.ThrowsAsync<ArgumentException>(() => Service(scope).RunAsync(BackgroundAppFactory.Reviewer, c.Id, Item, parameters));

        Assert.Contains("must be much longer than the coincidence window", ex.Message, StringComparison.Ordinal);
        Assert.Equal(before, (await Case(scope, "ER-C-0142")).Item(Item).Computations.Count);
    }

    [Fact]
    public async Task A_malformed_trigger_file_is_refused_naming_its_line_and_nothing_is_stored()
    {
        using var scope = app.Services.CreateScope();
        var cases = scope.ServiceProvider.GetRequiredService<CaseQueries>();
        var appender = scope.ServiceProvider.GetRequiredService<EvidenceAppender>();
        var c = await Case(scope, "ER-C-0142");
        const string item = "significance.far";
        var stored = Read(Latest(c, Item)!);
        var kp = stored.Sites.Single(s => s.SiteCode == "KP");
        var t = c.Arrivals.Single(a => a.SiteCode == "KP").Arrival;
        var bad = $"gps_time,snr\n{Gps(t)},14.2\n{Gps(t.AddSeconds(10))},not-a-number\n";
        var badSha = Hashing.Sha256Hex(Encoding.UTF8.GetBytes(bad));
        using (var stream = new MemoryStream(Encoding.UTF8.GetBytes(bad)))
        {
            await appender.AddAttachmentAsync(BackgroundAppFactory.Reviewer, c.Id, item, stream, "KP-bad-triggers.csv", "text/csv", "malformed on purpose", long.MaxValue);
        }

        var sites = stored.Sites.Select(s => new BackgroundSiteFiles(s.SiteCode, s.SiteCode == "KP" ? badSha : s.TriggersSha256, s.SegmentsSha256)).ToList();
        var ex = await Assert.ThrowsAnyAsync<FormatException>(() => Service(scope).RunAsync(BackgroundAppFactory.Reviewer, c.Id, item, new BackgroundCheckParameters(sites)));

        Assert.Contains("KP-bad-triggers.csv line 3", ex.Message, StringComparison.Ordinal);
        Assert.Empty((await Case(scope, "ER-C-0142")).Item(item).Computations);
        Assert.NotEqual(kp.TriggersSha256, badSha);
    }

    [Fact]
    public async Task Too_few_slides_for_three_sigma_is_a_concern_that_says_why()
    {
        using var scope = app.Services.CreateScope();
        var appender = scope.ServiceProvider.GetRequiredService<EvidenceAppender>();
        var c = await Case(scope, "ER-C-0157");
        const string item = "triage.significance";
        var start = new GpsTime(c.GpsNanoseconds - (36L * 3600 * GpsTime.NanosecondsPerSecond));
        var end = start.AddSeconds(48 * 3600);
        var picks = new List<BackgroundSiteFiles>();
        var seed = 77;
        foreach (var a in c.Arrivals.OrderBy(a => a.SiteCode))
        {
            var f = BackgroundDemoData.Simulate(a.SiteCode, seed++, start, end, a.Arrival, a.Snr);
            picks.Add(new BackgroundSiteFiles(a.SiteCode,
                await Attach(appender, c.Id, item, $"{a.SiteCode}-triggers.csv", f.TriggersCsv),
                await Attach(appender, c.Id, item, $"{a.SiteCode}-segments.csv", f.SegmentsCsv)));
        }

        // K = 2: 4 slides give about 4 x T_obs of background; the bound then cannot pass Q^-1(1 - exp(-1/4)) ~ 0.8 sigma
        var (updated, added, summary) = await Service(scope).RunAsync(BackgroundAppFactory.Reviewer, c.Id, item, new BackgroundCheckParameters(picks, SlidesK: 2));

        Assert.True(added);
        var record = Latest(updated, item)!;
        Assert.Equal("concern", record.Verdict);
        var pair = Assert.Single(Read(record).Check.Pairs);
        Assert.Equal(Verdict.Concern, pair.Judgement.Verdict);
        Assert.Equal("background too short", pair.Band);
        Assert.True(pair.MaxReachableSigma < 3);
        Assert.Contains("3σ needs at least", pair.Judgement.Reason, StringComparison.Ordinal);
        Assert.StartsWith("concern:", summary, StringComparison.Ordinal);
        Assert.Contains("FAR < ", summary, StringComparison.Ordinal);
        Assert.Contains("90 % upper bound", summary, StringComparison.Ordinal);
    }

    private static BackgroundCheckService Service(IServiceScope scope) => scope.ServiceProvider.GetRequiredService<BackgroundCheckService>();

    private static async Task<ReviewCase> Case(IServiceScope scope, string candidateId)
    {
        var cases = scope.ServiceProvider.GetRequiredService<CaseQueries>();
        var appender = scope.ServiceProvider.GetRequiredService<EvidenceAppender>();
        var id = (await cases.ListAsync(BackgroundAppFactory.Reviewer, search: candidateId)).Cases.Single(x => x.CandidateId == candidateId).Id;
        return await cases.GetAsync(BackgroundAppFactory.Reviewer, id);
    }

    private static ComputationRecord? Latest(ReviewCase c, string item) =>
        c.Item(item).Computations.Where(r => r.Kind == BackgroundCheckService.Kind).OrderByDescending(r => r.RunAt).ThenByDescending(r => r.Id).FirstOrDefault();

    private static BackgroundRecordResult Read(ComputationRecord r) =>
        System.Text.Json.JsonSerializer.Deserialize<BackgroundRecordResult>(r.ResultJson, CheckRecords.Json)!;

    private static async Task<SiteTriggers> Site(CaseFiles files, BackgroundSiteInput s)
    {
        var triggers = TriggerCsv.Parse(new StringReader(await files.ReadTextAsync(s.TriggersSha256)), s.TriggersFile);
        var segments = SegmentCsv.Parse(new StringReader(await files.ReadTextAsync(s.SegmentsSha256)), s.SegmentsFile);
        return SiteTriggers.Create(s.SiteCode, triggers, segments.Segments);
    }

    private static async Task<string> Attach(EvidenceAppender appender, int caseId, string item, string name, string text)
    {
        var bytes = Encoding.UTF8.GetBytes(text);
        using var stream = new MemoryStream(bytes);
        await appender.AddAttachmentAsync(BackgroundAppFactory.Reviewer, caseId, item, stream, name, "text/csv", "test input", long.MaxValue);
        return Hashing.Sha256Hex(bytes);
    }

    private static string Gps(GpsTime t) => $"{t.Nanoseconds / 1_000_000_000}.{t.Nanoseconds % 1_000_000_000:D9}";
}
