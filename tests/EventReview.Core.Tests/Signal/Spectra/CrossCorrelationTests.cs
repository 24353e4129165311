using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Tests.Signal.Spectra;

public class CrossCorrelationTests
{
    private static double X(int n) => n < 0 || n > 255 ? 0 : Math.Sin(0.3 * n) * Math.Exp(-Math.Pow((n - 100) / 12.0, 2));

    [Fact]
    public void A_delayed_flipped_copy_is_found_at_plus_seven_with_minus_one()
    {
        var x = Enumerable.Range(0, 256).Select(X).ToArray();
        var y = Enumerable.Range(0, 256).Select(n => -X(n - 7)).ToArray();
        var (lag, rho) = CrossCorrelation.Best(CrossCorrelation.Normalised(x, y, 20));
        // ref (numpy correlate, normalised as in CHECKS.md), first cross-correlation row
        Assert.Equal(7, lag);
        Assert.Equal(-1.0, rho, 1e-12);
    }

    [Fact]
    public void An_advanced_copy_with_an_added_burst_is_found_at_minus_four()
    {
        var x = Enumerable.Range(0, 256).Select(X).ToArray();
        var y = Enumerable.Range(0, 256).Select(n => (0.5 * X(n + 4)) + (0.3 * Math.Cos(0.7 * n) * Math.Exp(-Math.Pow((n - 130) / 15.0, 2)))).ToArray();
        var rhos = CrossCorrelation.Normalised(x, y, 20);
        var (lag, rho) = CrossCorrelation.Best(rhos);
        // ref (numpy correlate, normalised as in CHECKS.md), second cross-correlation row
        Assert.Equal(-4, lag);
        Assert.Equal(0.830863423206, rho, 1e-11);
        Assert.Equal(-0.579001366159, rhos.Min(), 1e-11);
    }
}
