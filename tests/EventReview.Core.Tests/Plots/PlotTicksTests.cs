using EventReview.Core.Plots;

namespace EventReview.Core.Tests.Plots;

public class PlotTicksTests
{
    [Fact]
    public void Linear_ticks_use_1_2_5_steps_inside_the_range()
    {
        Assert.Equal([0, 2, 4, 6, 8, 10], PlotTicks.Linear(0, 10));
        Assert.Equal([-0.2, 0, 0.2, 0.4, 0.6, 0.8], PlotTicks.Linear(-0.37, 0.83).Select(v => Math.Round(v, 12)));
        Assert.Equal([-50, 0, 50], PlotTicks.Linear(-60, 60, 3));
    }

    [Fact]
    public void Log_ticks_are_decades_over_wide_spans_and_add_2_and_5_over_short_ones()
    {
        Assert.Equal([10, 100, 1000], PlotTicks.Log(10, 2000));
        Assert.Equal([20, 50, 100, 200, 500], PlotTicks.Log(15, 600).Select(v => Math.Round(v, 9)));
    }

    [Fact]
    public void Tick_labels_typeset_powers_of_ten_and_the_minus_sign()
    {
        Assert.Equal("10⁻²¹", PlotTicks.Label(1e-21, AxisScale.Log));
        Assert.Equal("2×10⁻²³", PlotTicks.Label(2e-23, AxisScale.Log));
        Assert.Equal("−0.5", PlotTicks.Label(-0.5, AxisScale.Linear));
        Assert.Equal("200", PlotTicks.Label(200, AxisScale.Log));
        Assert.Equal("0", PlotTicks.Label(0, AxisScale.Linear));
    }

    [Fact]
    public void An_empty_range_is_widened_so_an_axis_still_has_ticks()
    {
        var axis = new PlotAxis("flat (m)", 3, 3);
        Assert.Equal((2.5, 3.5), axis.Range());
        Assert.NotEmpty(PlotTicks.Linear(2.5, 3.5));
        Assert.True(new PlotAxis("f (Hz)", 0, 100, AxisScale.Log).Range().Lo > 0);
    }
}
