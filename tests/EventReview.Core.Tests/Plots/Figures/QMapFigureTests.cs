using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Core.Tests.Plots.Figures;

public class QMapFigureTests
{
    private static QMap Map()
    {
        var t = Enumerable.Range(0, 200).Select(i => -1.0 + (i * 0.005)).ToArray();
        var f = Enumerable.Range(0, 40).Select(j => 20 * Math.Pow(1.08, j)).ToArray();
        var e = t.Select((ti, i) => f.Select((fj, j) => i == 150 && j == 20 ? 80.0 : 1.0 + ((i * 7 + j * 3) % 5 * 0.2)).ToArray()).ToArray();
        var q = t.Select(_ => f.Select(_ => 8.0).ToArray()).ToArray();
        return new QMap("1400000000", t, f, e, q, [4, 8, 16], 0.2);
    }

    [Fact]
    public void The_colour_bar_runs_from_an_eighth_of_the_cap_to_the_cap_at_the_995th_percentile()
    {
        var map = Map();
        var fig = QMapFigure.Build(map, null, "KX");
        double cap = Math.Max(map.Percentile(0.995), 2);
        Assert.NotNull(fig.ColourBar);
        Assert.Equal(cap, fig.ColourBar!.Max, 12);
        Assert.Equal(cap / 8, fig.ColourBar.Min, 12);
        Assert.Contains("power / median", fig.ColourBar.Label);
        Assert.Equal(AxisScale.Log, fig.Y.Scale);
        Assert.Contains("(Hz)", fig.Y.Label);
        Assert.Contains("(ms)", fig.X.Label);
        Assert.StartsWith("KX time-frequency map", fig.Caption);
    }

    [Fact]
    public void A_one_tile_peak_is_drawn_at_full_shade()
    {
        var drawing = PlotLayout.Lay(QMapFigure.Build(Map(), null, "KX"));
        // the bar's own top shade plus the peak's block
        Assert.True(drawing.Marks.OfType<AreaMark>().Count(a => a.Colour == PlotPalette.Ink) >= 2);
    }
}
