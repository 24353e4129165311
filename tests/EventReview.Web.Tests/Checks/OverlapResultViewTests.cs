using Bunit;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Signal.TimeFrequency;
using EventReview.Web.Components.Checks;
using EventReview.Web.Services.Checks;
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

    private static ComputationRecord Record(double overlap, double? p)
    {
        var core = new OverlapResult("1400000000.25", -0.00539, -0.005391, -1, overlap, 0.0021, 0.41, [-0.001, 0, 0.001], [0.1, -0.2, 0.1], 4096,
            "both series sampled at 4096 Hz; no resampling", [0.1, 0.2, 0.3], p, [0], [0], [0], 0.2, 0.01392, 30, 350, ["core assumption"]);
        var fit = new ChirpFit(25.3, 1.2, -0.01, 0.97, true, "frequency rises as the leading-order chirp law predicts", [-0.1], [40], ["T_sun"]);
        var result = new OverlapRecordResult("AB", "KP", "AB-strain.txt", "KP-strain.txt", core, 0.01397, "±13.97 ms = light-travel", -0.00539, true, false, 0.8, 0.01,
            "sign −1: KP is flipped", "overlap 0.93 >= 0.8",
            [new OverlapSiteMap("AB", "AB-strain.txt", fit, null, -2, 0.2, 20, 500, 8, 0.125, 40, -0.01, 60), new OverlapSiteMap("KP", "KP-strain.txt", null, "No segment fits", 0, 0, 0, 0, 0, 0.125, 0, 0, 0)],
            ["overlap threshold 0.8: common practice"]);
        return new ComputationRecord("overlap", "{}", "f", "v", CheckRecords.Serialize(result), "consistent", "s", string.Empty, new Actor("u", "U"), DateTimeOffset.UnixEpoch);
    }

    [Fact]
    public void Result_view_shows_lag_sign_alternative_p_value_and_chirp_masses_with_units()
    {
        var cut = Render<OverlapResultView>(p => p.Add(x => x.Record, Record(0.93, 0.005)));
        var text = cut.Markup;
        Assert.Contains("Refined lag (ms)", text);
        Assert.Contains("−5.39", text);
        Assert.Contains("allowed ±13.97 ms", text);
        Assert.Contains("0.410 at +2.10 ms", text); // the other sign's best
        Assert.Contains("3 off-source trials", text);
        Assert.Contains("Chirp mass (M☉)", text);
        Assert.Contains("25.3", text);
        Assert.Contains("map not made: No segment fits", text);
        Assert.Contains("common practice", text);
    }

    [Fact]
    public void Result_view_marks_a_low_overlap_and_a_weak_p_value()
    {
        var cut = Render<OverlapResultView>(p => p.Add(x => x.Record, Record(0.55, 0.2)));
        Assert.Contains("inconsistent", cut.Find("table.data tbody tr:nth-child(2)").TextContent);
        Assert.Contains("concern", cut.Markup);
    }
}
