using EventReview.Core.Environment;
using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Plots.Figures;

public class EnvironmentTimelineFigureTests
{
    private static readonly GpsTime T = GpsTime.FromSeconds(1000m);

    [Fact]
    public void Each_hit_is_a_dot_with_its_snr_each_flag_a_bar_and_each_channel_a_named_row()
    {
        var triggers = new[]
        {
            new AuxiliaryTrigger("KX", "env/seismometer<x>", T.AddSeconds(0.2), 12, null, null),
            new AuxiliaryTrigger("KX", "env/seismometer<x>", T.AddSeconds(-0.5), 7, null, null),
            new AuxiliaryTrigger("MV", "env/magnetometer", T.AddSeconds(0.1), 30, null, null),
        };
        var segs = new[] { new DataQualitySegment("MV", "gusty-wind", T.AddSeconds(-10), T.AddSeconds(0.3), null) };
        var report = EnvironmentLookup.Run(new EnvironmentLookupInput(T, new Dictionary<string, GpsTime>(), ["KX", "MV"], segs, triggers, []));

        var fig = EnvironmentTimelineFigure.Build(report, 1.0);

        Assert.Equal(3, fig.Elements.OfType<PlotPoints>().Count());
        Assert.Contains(fig.Elements.OfType<PlotText>(), t => t.Text == "SNR 30");
        Assert.Contains(fig.Elements.OfType<PlotText>(), t => t.Text == "gusty-wind");
        Assert.Equal(["MV data-quality flags", "MV env/magnetometer [other]", "KX env/seismometer<x> [other]"], fig.Y.Categories);
        Assert.Contains("3 trigger(s), 1 data-quality segment(s)", fig.Caption);
        Assert.Contains("concern", fig.Caption);
        var window = fig.Elements.OfType<PlotBand>().First();
        Assert.Equal([-1.0, 1.0], window.Xs);
        FigureBackEndTests.AssertDrawable(fig);
        Assert.Contains("env/seismometer&lt;x&gt;", PlotSvg.Write(fig));
    }

    [Fact]
    public void A_long_channel_name_widens_the_label_room_instead_of_running_into_the_axes()
    {
        const string Long = "KX/env/magnetometer-electronics-vault-second-rack/x";
        var triggers = new[] { new AuxiliaryTrigger("KX", Long, T.AddSeconds(0.1), 9, null, null) };
        var report = EnvironmentLookup.Run(new EnvironmentLookupInput(T, new Dictionary<string, GpsTime>(), ["KX", "MV"], [], triggers, []));
        var fig = EnvironmentTimelineFigure.Build(report, 1.0);
        var name = fig.Y.Categories!.Single(n => n.Contains(Long, StringComparison.Ordinal));
        // DejaVu Sans at 12 px averages under 7.4 px a character for these names (our estimate); the name is drawn right-aligned
        // 8 px left of the axes, so the axes must start at least that far in, with room for the rotated axis label.
        Assert.True(PlotFrame.For(fig).Left >= 8 + (7.4 * name.Length) + 24, $"axes start at {PlotFrame.For(fig).Left} px for {name.Length} characters");
        Assert.Contains("MV: nothing in its window", fig.Y.Categories!); // a quiet site keeps its row
    }

    [Fact]
    public void A_window_that_is_not_positive_is_refused()
    {
        var report = EnvironmentLookup.Run(new EnvironmentLookupInput(T, new Dictionary<string, GpsTime>(), ["KX"], [], [], []));
        Assert.Throws<ArgumentOutOfRangeException>(() => EnvironmentTimelineFigure.Build(report, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => EnvironmentTimelineFigure.Build(report, double.NaN));
    }
}
