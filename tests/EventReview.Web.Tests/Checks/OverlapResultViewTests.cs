using Bunit;
using EventReview.Core.Cases;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Signal.TimeFrequency;
using EventReview.Core.Verdicts;
using EventReview.Web.Components.Checks;
using Microsoft.Extensions.DependencyInjection;
using MudBlazor.Services;

namespace EventReview.Web.Tests.Checks;

public sealed class OverlapResultViewTests : BunitContext
{
    public OverlapResultViewTests()
    {
        Services.AddMudServices(o => o.SnackbarConfiguration.ShowTransitionDuration = 0);
        JSInterop.Mode = JSRuntimeMode.Loose;
    }

    private static ComputationRecord Record(double overlap, double? p, bool signDetermined = true, bool atEdge = false, string verdict = "consistent")
    {
        var core = new OverlapResult("1400000000.25", -0.00539, -0.005391, -1, overlap, [-0.001, 0, 0.001], [0.1, -0.2, 0.1], 4096,
            "both series sampled at 4096 Hz; no resampling", [0.1, 0.2, 0.3], p, [0], [0], [0], 0.2, 0.01392, 25, 400, ["core assumption"],
            0.00042, 3.01, signDetermined, overlap * 0.99, [0.3, 0.9, 0.3], atEdge, atEdge ? ["the best lag lies within one sample of the search limit"] : [], 0.21);
        var fit = new ChirpFit(25.3, 1.2, -0.01, 0.97, true, "frequency rises as the leading-order chirp law predicts", [-0.1], [40], ["T_sun"],
            ["can tell: the frequency rises", "cannot tell: the component masses"]);
        var result = new OverlapReviewResult("AB", "KP", "AB-strain.txt", "KP-strain.txt", core, 0.01397, "±13.97 ms = light-travel", -0.00539, !atEdge, atEdge, 0.8, 0.01,
            "KP is turned by 172° against AB: sign −1 (flipped)", "overlap 0.93 >= 0.8",
            [new OverlapSiteMap("AB", "AB-strain.txt", fit, null, -2, 0.2, 20, 500, 0, 0, 40, -0.01, 60, 11.3, 5.7, 45.3, 0.2, 18.5),
             new OverlapSiteMap("KP", "KP-strain.txt", null, "No segment fits", 0, 0, 0, 0, 0, 0, 0, 0, 0)],
            ["overlap threshold 0.8: common practice"], new Judgement(VerdictWords.TryParse(verdict, out var v) ? v : Verdict.NotRun, "reason from Core: overlap 0.93 >= 0.8"));
        return new ComputationRecord("overlap", "{}", "f", "v", CheckRecords.Serialize(result), verdict, "s", string.Empty, new Actor("u", "U"), DateTimeOffset.UnixEpoch);
    }

    [Fact]
    public void Result_view_shows_lag_with_its_uncertainty_phase_p_value_and_chirp_masses_with_units()
    {
        var cut = Render<OverlapResultView>(p => p.Add(x => x.Record, Record(0.93, 0.005)));
        var text = cut.Markup;
        Assert.Contains("reason from Core", text); // the view draws Core's judgement, it does not judge again
        Assert.Contains("Lag (ms)", text);
        Assert.Contains("−5.39 ± 0.42", text);
        Assert.Contains("allowed ±13.97 ms", text);
        Assert.Contains("172° ± 12°", text);
        Assert.Contains("sign −1 (flipped)", text);
        Assert.Contains("3 off-source trials", text);
        Assert.Contains("Chirp mass (M☉)", text);
        Assert.Contains("25.3", text);
        Assert.Contains("cannot tell: the component masses", text);
        Assert.Contains("Q 5.7–45.3", text);
        Assert.Contains("map not made: No segment fits", text);
        Assert.Contains("common practice", text);
    }

    [Fact]
    public void Result_view_shows_an_undetermined_sign_and_the_search_edge_warning()
    {
        var cut = Render<OverlapResultView>(p => p.Add(x => x.Record, Record(0.55, 0.2, signDetermined: false, atEdge: true, verdict: "inconsistent")));
        Assert.Contains("sign undetermined", cut.Markup);
        Assert.Contains("Warning: the best lag lies within one sample of the search limit", cut.Markup);
        Assert.Contains("inconsistent", cut.Markup);
    }

    [Fact]
    public void A_record_of_format_1_still_draws_with_its_stored_word()
    {
        // The stored JSON of a format-1 record (real correlation, no uncertainty, STFT maps), as the previous version wrote it.
        const string json = """
            {"siteA":"AB","siteB":"KP","fileA":"AB-strain.txt","fileB":"KP-strain.txt","overlap":{"centerGps":"1400000000.25","lagSeconds":-0.00539,
            "refinedLagSeconds":-0.005391,"sign":-1,"overlap":0.93,"alternativeLagSeconds":0.0021,"alternativeOverlap":0.41,"lagsSeconds":[-0.001,0,0.001],
            "correlation":[0.1,-0.2,0.1],"sampleRateHz":4096,"resamplingNote":"no resampling","offSourceOverlaps":[0.1,0.2],"pValue":0.005,"plotTimesSeconds":[0],
            "plotA":[0],"plotB":[0],"windowSeconds":0.2,"maxLagSeconds":0.01392,"bandLowHz":25,"bandHighHz":400,"assumptions":["old core assumption"]},
            "allowedLagSeconds":0.01397,"allowedLagRule":"±13.97 ms","caseLagSeconds":null,"lagWithinWindow":true,"peakAtSearchEdge":false,"overlapThreshold":0.5,
            "pValueThreshold":0.01,"signNote":"sign −1: KP is flipped","verdictReason":"overlap 0.93 >= 0.5, lag inside the window","maps":[{"site":"AB",
            "fileName":"AB-strain.txt","fit":null,"error":"too short","fromSeconds":0,"toSeconds":0,"lowHz":0,"highHz":0,"resolutionHz":0,"segmentSeconds":0.125,
            "peakEnergy":0,"peakSeconds":0,"peakHz":0}],"assumptions":["old assumption"]}
            """;
        var record = new ComputationRecord("overlap", "{}", "f", "v", json.ReplaceLineEndings(string.Empty), "consistent", "s", string.Empty, new Actor("u", "U"), DateTimeOffset.UnixEpoch);

        var cut = Render<OverlapResultView>(p => p.Add(x => x.Record, record));

        Assert.Contains("consistent", cut.Markup);
        Assert.Contains("lag inside the window", cut.Markup);
        Assert.Contains("record of format 1", cut.Markup);
        Assert.DoesNotContain("could not be read", cut.Markup);
    }
}
