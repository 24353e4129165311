using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Significance;
using EventReview.Core.Statistics;
using EventReview.Core.Tests.Significance;

namespace EventReview.Core.Tests.Plots.Figures;

public class BackgroundFigureTests
{
    private static BackgroundResult Run(double candidate)
    {
        var rng = new Random(2);
        var a = TimeSlideBackgroundTests.PoissonSite("KX", rng, 0.3, 2e4);
        var b = TimeSlideBackgroundTests.PoissonSite("MV", rng, 0.3, 2e4);
        return TimeSlideBackground.Run(a, b, new TimeSlideOptions { WindowNs = 15_000_000, StepNs = 3_000_000_000, Slides = 500, CandidateStatistic = candidate });
    }

    [Fact]
    public void The_sigma_levels_are_rates_over_the_observing_time_and_the_measured_far_has_its_poisson_error()
    {
        var r = Run(8);
        Assert.False(r.FarIsBound);
        var fig = BackgroundFigure.Build(r);
        // 5σ as a rate over T_obs: −ln(1 − Q(5)) / T_obs with Q(5) = 2.8665e-7 (Abramowitz and Stegun, table 26.1, from memory).
        double rate5 = -Math.Log(1 - 2.8665e-7) / r.ObservingTimeSeconds;
        var five = fig.Elements.OfType<PlotLine>().Single(l => l.Label?.StartsWith("5σ", StringComparison.Ordinal) == true);
        Assert.Equal(rate5, five.Ys[0], rate5 * 1e-3);
        Assert.Equal(-Math.Log(1 - GaussianTail.Q(3)) / r.ObservingTimeSeconds, fig.Elements.OfType<PlotLine>().Single(l => l.Label?.StartsWith("3σ", StringComparison.Ordinal) == true).Ys[0], 1e-15);
        var candidate = fig.Elements.OfType<PlotPoints>().Single();
        Assert.Equal(r.FarHz, candidate.Ys[0]);
        Assert.EndsWith("with its 1σ interval", candidate.Label);
        Assert.Equal(AxisScale.Log, fig.Y.Scale);
        Assert.Contains("(1/s)", fig.Y.Label);
        Assert.True(fig.Y.Min <= fig.Elements.OfType<PlotLine>().Where(l => l.Ys.Count > 2).SelectMany(l => l.Ys).Min());
        FigureBackEndTests.AssertDrawable(fig);
    }

    [Fact]
    public void Poisson_intervals_match_the_published_table()
    {
        // Gehrels 1986, ApJ 303, 336, tables 1 and 2 (S = 1, 84.13 %), from memory: n = 1 gives 0.173 to 3.300, n = 10 gives
        // 6.891 to 14.27; the closed forms used for the band agree to about 1 %.
        Assert.Equal(3.300, BackgroundFigure.PoissonUpper(1), 0.03);
        Assert.Equal(0.173, BackgroundFigure.PoissonLower(1), 0.002);
        Assert.Equal(14.27, BackgroundFigure.PoissonUpper(10), 0.02);
        Assert.Equal(6.891, BackgroundFigure.PoissonLower(10), 0.01);
        Assert.Equal(0, BackgroundFigure.PoissonLower(0));
    }

    [Fact]
    public void A_candidate_louder_than_everything_is_drawn_as_a_bound_with_its_confidence_level()
    {
        // The naive reading of "no background as loud" is a FAR of zero; the figure must show the 90 % upper bound instead.
        var r = Run(1e3);
        Assert.True(r.FarIsBound);
        var fig = BackgroundFigure.Build(r);
        var candidate = fig.Elements.OfType<PlotPoints>().Single();
        Assert.Contains("< ", candidate.Label);
        Assert.Contains("90% upper bound", candidate.Label);
        Assert.True(candidate.Ys[0] > 0);
        Assert.Contains("≥ ", fig.Caption);
        Assert.True(fig.X.Max > 1e3);
        FigureBackEndTests.AssertDrawable(fig);
    }
}
