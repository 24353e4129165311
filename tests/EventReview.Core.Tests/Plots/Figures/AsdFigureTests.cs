using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Tests.Plots.Figures;

public class AsdFigureTests
{
    private const double Fs = 1024;

    private static Psd WhitePsd(double sigma, int seed)
    {
        var rng = new Random(seed);
        var x = Enumerable.Range(0, 16 * (int)Fs).Select(_ => sigma * Gaussian(rng)).ToArray();
        return Conditioning.EstimatePsd(new TimeSeries(EventReview.Core.Time.GpsTime.FromSeconds(1000m), Fs, x), new ConditioningOptions(PsdSegmentSeconds: 2));
    }

    private static double Gaussian(Random rng) => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());

    [Fact]
    public void White_noise_sits_at_sigma_root_two_over_fs_on_a_log_log_plot_with_the_band_where_it_was_analysed()
    {
        // One-sided PSD of white noise of standard deviation σ is 2σ²/fs (Parseval: its integral over 0..fs/2 is σ²;
        // Heinzel, Rüdiger and Schilling 2002, eq. 24), so the ASD is σ·√(2/fs).
        double sigma = 3e-21;
        var fig = AsdFigure.Build([("KX", WhitePsd(sigma, 1)), ("MV", WhitePsd(sigma, 2))], 40, 300);
        var lines = fig.Elements.OfType<PlotLine>().ToList();
        Assert.Equal(2, lines.Count);
        double expected = sigma * Math.Sqrt(2 / Fs);
        foreach (var line in lines)
        {
            var sorted = line.Ys.Order().ToArray();
            Assert.InRange(sorted[sorted.Length / 2] / expected, 0.85, 1.15);
        }

        Assert.Equal(AxisScale.Log, fig.X.Scale);
        Assert.Equal(AxisScale.Log, fig.Y.Scale);
        Assert.Equal(Fs / 2, fig.X.Max);
        Assert.Contains("(Hz)", fig.X.Label);
        Assert.Contains("(1/√Hz)", fig.Y.Label);
        var band = Assert.Single(fig.Elements.OfType<PlotBand>());
        Assert.Equal([40.0, 300.0], band.Xs);
        var frame = PlotFrame.For(fig);
        var shaded = PlotLayout.Lay(fig).Marks.OfType<AreaMark>().First(a => a.Colour == PlotPalette.Shade);
        Assert.Equal(frame.Px(40), shaded.Points.Min(p => p.X), 1);
        Assert.Equal(frame.Px(300), shaded.Points.Max(p => p.X), 1);
        FigureBackEndTests.AssertDrawable(fig);
    }

    [Fact]
    public void A_narrow_line_survives_the_reduction_to_columns()
    {
        // The mean over a column would hide a one-bin line 20x above the floor; keeping each column's maximum does not.
        var psd = WhitePsd(1e-21, 3);
        var values = (double[])psd.Values.Clone();
        int k = (int)Math.Round(123.0 / psd.FrequencyStepHz);
        values[k] *= 400;
        var fig = AsdFigure.Build([("KX", psd with { Values = values })], 40, 300);
        var line = fig.Elements.OfType<PlotLine>().Single();
        Assert.Contains(line.Ys, y => y >= Math.Sqrt(values[k]) * 0.999);
    }

    [Fact]
    public void A_band_outside_zero_to_high_is_refused_with_its_reason()
    {
        var ex = Assert.Throws<ArgumentException>(() => AsdFigure.Build([("KX", WhitePsd(1, 4))], 300, 40));
        Assert.Contains("0 < low < high", ex.Message);
    }
}
