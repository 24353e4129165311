using EventReview.Core.Statistics;

namespace EventReview.Core.Tests.Statistics;

public class ExpMinusOneTests
{
    [Theory]
    // Taylor series x + x^2/2 + x^3/6 + x^4/24 (textbook), summed here to full precision for small x
    [InlineData(-5e-3)]
    [InlineData(1e-8)]
    [InlineData(-3e-12)]
    public void Small_arguments_keep_full_relative_precision(double x)
    {
        var series = x + (x * x / 2) + (x * x * x / 6) + (x * x * x * x / 24) + (x * x * x * x * x / 120);
        Assert.Equal(series, ExpMinusOne.Of(x), Math.Abs(series) * 1e-14); // a few ulps
    }

    [Fact]
    public void Large_arguments_match_the_direct_formula()
    {
        Assert.Equal(Math.Exp(2.5) - 1, ExpMinusOne.Of(2.5), 1e-14);
        Assert.Equal(-1.0, ExpMinusOne.Of(-800));
        Assert.Equal(0.0, ExpMinusOne.Of(0.0));
    }
}
