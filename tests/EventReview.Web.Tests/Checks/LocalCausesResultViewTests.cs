using Bunit;
using EventReview.Core.Cases;
using EventReview.Core.Environment;
using EventReview.Core.Evidence;
using EventReview.Core.Injections;
using EventReview.Core.Verdicts;
using EventReview.Web.Components.Checks;
using EventReview.Web.Services.Checks;
using Microsoft.Extensions.DependencyInjection;
using MudBlazor;
using MudBlazor.Services;

namespace EventReview.Web.Tests.Checks;

public sealed class LocalCausesResultViewTests : BunitContext
{
    public LocalCausesResultViewTests()
    {
        Services.AddMudServices(o => o.SnackbarConfiguration.ShowTransitionDuration = 0);
        JSInterop.Mode = JSRuntimeMode.Loose;
    }

    private static ComputationRecord Record(string kind, object result, string verdict) =>
        new(kind, "{}", "f", "v", CheckRecords.Serialize(result), verdict, "s", string.Empty, new Actor("u", "U"), DateTimeOffset.UnixEpoch);

    [Fact]
    public void Environment_view_lists_each_hit_with_offset_in_ms_chance_probability_safety_and_coupling_and_each_site_reason()
    {
        var hit = new EnvironmentHit("AB", "AB/env/magnetometer-electronics-vault/x", "magnetic", 1000.0, -0.182, 23.5, 75, 1, 15 / 3600.0, 8.3e-3, true, 0.0282, 2.8e-23, false, true);
        var report = new EnvironmentReport(1000, [hit], [], [], [new SiteVerdict("AB", 1000.182, true, new Judgement(Verdict.Concern, "AB: trigger"), ["trigger of AB/env/magnetometer-electronics-vault/x"]),
            new SiteVerdict("KP", 1000, false, new Judgement(Verdict.Clear, "KP: nothing"), [])], new Judgement(Verdict.Concern, "AB: trigger of AB/env/magnetometer-electronics-vault/x"), [], ["window +-1 s"]);
        var view = Render<EnvironmentResultView>(p => p.Add(v => v.Record, Record("environment", new EnvironmentRecordResult(RecordFormat.Current, report, null, 0.0228, "network", ["a note"], []), "concern")));

        Assert.Contains("-182.0", view.Markup, StringComparison.Ordinal);
        Assert.Contains("8.30E-3", view.Markup, StringComparison.Ordinal);
        Assert.Contains("2.82 %", view.Markup, StringComparison.Ordinal);
        Assert.Contains("case time (no arrival)", view.Markup, StringComparison.Ordinal);
        Assert.Contains("trigger of AB/env/magnetometer-electronics-vault/x", view.Markup, StringComparison.Ordinal);
        Assert.Contains("22.80 ms", view.Markup, StringComparison.Ordinal);
        Assert.Contains("a note", view.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public void Injections_view_shows_the_verified_seal_and_every_overlap_per_site()
    {
        var report = new InjectionOverlapReport([new InjectionOverlapHit("AB", 995, 1005, "cbc", "blind-3", "performed", 0)],
            [new SiteTime("AB", 1000, true), new SiteTime("KP", 1000, true)], 10, new Judgement(Verdict.Concern, "1 injection(s) overlap"), ["margin"]);
        var seal = new SealInfo(1, "Spring run", new string('a', 64), new string('b', 64), "C", DateTimeOffset.UnixEpoch, "D", DateTimeOffset.UnixEpoch);
        var view = Render<InjectionsResultView>(p => p.Add(v => v.Record, Record("injections", new InjectionRecordResult(RecordFormat.Current, "sealed-record", report, 1, [], seal), "concern")));

        Assert.Contains("Spring run", view.Markup, StringComparison.Ordinal);
        Assert.Contains(new string('a', 64), view.Markup, StringComparison.Ordinal);
        Assert.Contains("blind-3", view.Markup, StringComparison.Ordinal);
        var kp = view.FindAll("tr").Single(r => r.QuerySelector("td")?.TextContent == "KP");
        Assert.Contains("none", kp.TextContent, StringComparison.Ordinal);
    }
}
