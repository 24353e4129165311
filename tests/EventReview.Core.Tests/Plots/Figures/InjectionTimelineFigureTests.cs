using EventReview.Core.Injections;
using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Plots.Figures;

public class InjectionTimelineFigureTests
{
    private static readonly GpsTime T = GpsTime.FromSeconds(2000m);

    private static InjectionRecord Entry(string site, double fromSeconds, double toSeconds, InjectionStatus status) =>
        new(site, T.AddSeconds(fromSeconds), T.AddSeconds(toSeconds), "cbc", "wave-" + site, status);

    [Fact]
    public void Entries_near_the_candidate_are_bars_by_status_and_the_arrivals_are_marked()
    {
        InjectionRecord[] log =
        [
            Entry("KX", -0.5, 0.2, InjectionStatus.Performed),
            Entry("MV", 20, 21, InjectionStatus.Aborted),
            Entry("MV", 5000, 5001, InjectionStatus.Scheduled),
        ];
        var arrivals = new Dictionary<string, GpsTime> { ["KX"] = T.AddSeconds(0.004), ["MV"] = T.AddSeconds(-0.003) };
        var report = InjectionOverlap.Find(log, T, arrivals, ["KX", "MV"], 0.1);

        var fig = InjectionTimelineFigure.Build(log, report, T.Seconds);

        Assert.Equal((-60.0, 60.0), (fig.X.Min, fig.X.Max));
        Assert.Equal(["MV", "KX"], fig.Y.Categories); // first site on top
        var bars = fig.Elements.OfType<PlotBand>().Where(b => b.Opacity < 1).ToList();
        Assert.Equal(2, bars.Count); // the scheduled one is 5000 s away, outside the view
        Assert.Contains(bars, b => b.Colour == PlotPalette.Alarm && b.Label == "performed injection");
        Assert.Contains(bars, b => b.Colour == PlotPalette.Grey && b.Label == "aborted injection");
        var dots = fig.Elements.OfType<PlotPoints>().Single();
        Assert.Equal(2, dots.Xs.Count);
        Assert.Contains("2 of 3 entries", fig.Caption);
        Assert.Contains("1 overlapping", fig.Caption);
        FigureBackEndTests.AssertDrawable(fig);
    }

    [Fact]
    public void With_nothing_close_the_view_widens_to_the_nearest_entry_so_an_empty_picture_is_never_shown()
    {
        // Naively a ±60 s window with no bar reads "no injection"; the figure instead reaches out to the nearest entry and says how far it is.
        InjectionRecord[] log = [Entry("KX", -900, -880, InjectionStatus.Performed)];
        var report = InjectionOverlap.Find(log, T, new Dictionary<string, GpsTime>(), ["KX"], 0.1);
        var fig = InjectionTimelineFigure.Build(log, report, T.Seconds);
        Assert.Equal(880 * 1.2, fig.X.Max, 6);
        Assert.Contains("nearest entry 880 s from the candidate", fig.Caption);
        Assert.Single(fig.Elements.OfType<PlotBand>(), b => b.Opacity < 1);
    }

    [Fact]
    public void An_empty_log_says_so()
    {
        var report = InjectionOverlap.Find([], T, new Dictionary<string, GpsTime>(), ["KX"], 0.1);
        var fig = InjectionTimelineFigure.Build([], report, T.Seconds);
        Assert.Contains("the log has no entry for these sites", fig.Caption);
        FigureBackEndTests.AssertDrawable(fig);
    }
}
