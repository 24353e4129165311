using Bunit;
using EventReview.Core.Cases;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Core.Timing;
using EventReview.Web.Components.Checks;
using Microsoft.Extensions.DependencyInjection;
using MudBlazor.Services;

namespace EventReview.Web.Tests.Checks;

public sealed class TimingResultViewTests : BunitContext
{
    // Invented four-site geometry (letters-only codes), 0.5 ms timing uncertainty each.
    private static readonly Site[] Sites =
    [
        new("PA", "Pale Anchor", 52.0, 8.0, 100, 10, 100, 5e-4),
        new("QB", "Quiet Bay", -31.0, 118.0, 20, 45, 135, 5e-4),
        new("RC", "Red Cedar", 38.0, -98.0, 400, 300, 30, 5e-4),
        new("SD", "Salt Dune", 5.0, 30.0, 600, 70, 160, 5e-4),
    ];

    public TimingResultViewTests()
    {
        Services.AddMudServices(o => o.SnackbarConfiguration.ShowTransitionDuration = 0);
        JSInterop.Mode = JSRuntimeMode.Loose;
    }

    private static ComputationRecord Record(string resultJson, string verdict) =>
        new("timing", "{}", "f", "v", resultJson, verdict, "s", string.Empty, new Actor("u", "U"), DateTimeOffset.UnixEpoch);

    [Fact]
    public void The_view_shows_the_chi_square_with_its_degrees_of_freedom_p_value_and_the_sky_frame()
    {
        var t0 = GpsTime.FromSeconds(1400000000m);
        var arrivals = NetworkProjection.Project(Sites, SkyFrame.ToEcef(150, 20, 0), 0).Select(p => new SiteArrival(p.Code, t0.AddSeconds(0.6 * p.DelaySeconds))).ToArray();
        var result = TimingReview.Run(Sites, arrivals, new TimingCheckParameters());

        var cut = Render<TimingResultView>(p => p.Add(x => x.Record, Record(CheckRecords.Serialize(result), result.Judgement!.Word)));
        var text = cut.Markup;

        Assert.Contains("no single direction fits", text); // Core's reason, drawn as is
        Assert.Contains("Degrees of freedom", text);
        Assert.Contains(result.Timing.Chi2!.Value.ToString("0.##", System.Globalization.CultureInfo.InvariantCulture), text);
        Assert.Contains(result.Timing.PValue!.Value.ToString("G3", System.Globalization.CultureInfo.InvariantCulture), text);
        Assert.Contains("false-alarm probability 0.0027", text);
        Assert.Contains("RA (deg, mean of date)", text);
        Assert.Contains("From ICRS (deg)", text);
        Assert.Contains(" ± 0.707", text); // Δt with its combined one-sigma uncertainty, ms
    }

    [Fact]
    public void A_record_of_format_1_still_draws()
    {
        // The stored JSON of a format-1 timing record (RMS rule, no chi-square, no judgement), as the previous version wrote it.
        const string json = """
            {"timing":{"verdict":"consistent","consistent":true,"kSigma":3,"pairs":[{"a":"PA","b":"QB","baselineMeters":1.2E7,"lightTravelSeconds":0.04,
            "combinedSigmaSeconds":0.0007,"allowedSeconds":0.0421,"observedSeconds":0.01,"marginSeconds":0.0321,"consistent":true,"ringCosine":0.25,
            "ringAngleDegrees":75.5,"rule":"allowed = light-travel 40.000 ms + 3σ × 0.707 ms = 42.121 ms; observed 10.000 ms"}],"sky":[],"ringsMeet":null,
            "minimalResidualSeconds":null,"skyResidualAllowedSeconds":null,"skyNote":"two sites: the direction is only known to lie on the ring of the pair",
            "earliestArrivalGps":"1400000000","utc":"2024-05-17T16:53:02.000000Z","gmstDegrees":123.4,"assumptions":["old assumption"],"warnings":[]},"antenna":null}
            """;
        var cut = Render<TimingResultView>(p => p.Add(x => x.Record, Record(json.ReplaceLineEndings(string.Empty), "consistent")));

        Assert.Contains("PA → QB", cut.Markup);
        Assert.Contains("two sites", cut.Markup);
        Assert.DoesNotContain("could not be read", cut.Markup);
    }
}
