using EventReview.Core.Statistics;

namespace EventReview.Core.Tests.Statistics;

public class BinomialTests
{
    [Theory]
    // CHECKS.md "Calibrated verdicts", values from scipy.stats 1.10 (binom.sf(k - 1, n, q))
    [InlineData(30, 30, 0.42, 4.983e-12)]
    [InlineData(20, 30, 0.42, 5.586e-3)]
    [InlineData(12, 30, 0.42, 0.6545)]
    [InlineData(3, 10, 0.05, 1.150e-2)]
    [InlineData(5, 100, 0.01, 3.432e-3)]
    public void Upper_tail_matches_the_reference_library(int k, int n, double q, double expected)
    {
        Assert.Equal(1.0, Binomial.AtLeast(k, n, q) / expected, 1e-3);
    }

    [Fact]
    public void Edges_and_the_poisson_binomial_form_agree()
    {
        Assert.Equal(1.0, Binomial.AtLeast(0, 10, 0.3));
        Assert.Equal(0.0, Binomial.AtLeast(11, 10, 0.3));
        Assert.Equal(Binomial.AtLeast(20, 30, 0.42), Binomial.AtLeast(20, Enumerable.Repeat(0.42, 30).ToList()), 1e-14);
        // two trials of 0.5 and 0.2, by hand: P(K >= 1) = 1 - 0.5 x 0.8, P(K >= 2) = 0.5 x 0.2
        Assert.Equal(0.6, Binomial.AtLeast(1, [0.5, 0.2]), 1e-15);
        Assert.Equal(0.1, Binomial.AtLeast(2, [0.5, 0.2]), 1e-15);
        Assert.Throws<ArgumentOutOfRangeException>(() => Binomial.AtLeast(1, 2, 1.5));
    }

    [Fact]
    public void The_ninety_percent_upper_limit_for_no_events_is_2_3026()
    {
        // CHECKS.md: Gehrels 1986, table 1 (from memory): 2.3026 / T at 90 % confidence; -ln(0.1) = 2.302585093
        Assert.Equal(2.302585093, Poisson.UpperLimitForNoEvents(0.9), 1e-9);
        Assert.Throws<ArgumentOutOfRangeException>(() => Poisson.UpperLimitForNoEvents(1));
    }
}
