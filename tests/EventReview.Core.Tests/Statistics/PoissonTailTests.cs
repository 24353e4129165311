using EventReview.Core.Statistics;

namespace EventReview.Core.Tests.Statistics;

public class PoissonTailTests
{
    [Fact]
    public void At_least_one_event_is_one_minus_exp_of_minus_mu()
    {
        Assert.Equal(1 - Math.Exp(-0.3), Poisson.ProbabilityAtLeast(1, 0.3), 1e-15); // textbook: P(0) = exp(-mu)
        Assert.Equal(1e-12, Poisson.ProbabilityAtLeast(1, 1e-12), 1e-24);             // no cancellation for tiny mu
    }

    [Fact]
    public void At_least_three_with_mean_two_matches_the_summed_terms()
    {
        // textbook: 1 - exp(-2) (1 + 2 + 2^2/2) = 1 - 5 exp(-2)
        Assert.Equal(1 - (5 * Math.Exp(-2)), Poisson.ProbabilityAtLeast(3, 2.0), 1e-13);
        Assert.Equal(5 * Math.Exp(-2), Poisson.ProbabilityAtMost(2, 2.0), 1e-13);
    }

    [Fact]
    public void Edge_counts_and_means_are_handled()
    {
        Assert.Equal(1.0, Poisson.ProbabilityAtLeast(0, 3.0));
        Assert.Equal(0.0, Poisson.ProbabilityAtLeast(2, 0.0));
        Assert.Equal(0.0, Poisson.ProbabilityAtMost(-1, 1.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => Poisson.ProbabilityAtLeast(1, -1.0));
    }
}
