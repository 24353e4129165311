using EventReview.Core.Statistics;

namespace EventReview.Core.Tests.Statistics;

public class GaussianTailTests
{
    [Theory]
    // Abramowitz & Stegun table 26.1 (from memory), 1e-10 relative
    [InlineData(1.0, 0.158655253931)]
    [InlineData(2.0, 0.0227501319482)]
    [InlineData(3.0, 1.34989803163e-3)]
    [InlineData(4.0, 3.16712418331e-5)]
    [InlineData(5.0, 2.86651571879e-7)]
    [InlineData(6.0, 9.86587645038e-10)]
    public void Q_matches_the_printed_normal_tail(double x, double expected)
    {
        Assert.Equal(expected, GaussianTail.Q(x), expected * 1e-10);
    }

    [Theory]
    // A&S table 26.5 (from memory), ref (scipy.stats.norm.isf), 1e-8
    [InlineData(0.05, 1.644853627)]
    [InlineData(1e-3, 3.090232306)]
    [InlineData(1e-6, 4.753424309)]
    [InlineData(1e-7, 5.199337582)]
    public void Inverse_Q_matches_the_printed_percentage_points(double p, double expected)
    {
        Assert.Equal(expected, GaussianTail.InverseQ(p), 1e-8);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(1e-3)]
    [InlineData(1e-15)]
    [InlineData(0.9)]
    public void Inverse_Q_round_trips_down_to_1e_minus_15(double p)
    {
        Assert.Equal(p, GaussianTail.Q(GaussianTail.InverseQ(p)), p * 1e-10);
    }

    [Fact]
    public void Five_sigma_is_the_usual_one_sided_probability()
    {
        Assert.Equal(2.87e-7, GaussianTail.Q(5.0), 0.005e-7); // trade: "5 sigma" = one-sided 2.87e-7
        Assert.Equal(5.0, GaussianTail.SigmaFromProbability(GaussianTail.Q(5.0)), 1e-9);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(0.7)]
    [InlineData(1.0)]
    public void Sigma_is_zero_when_the_probability_is_one_half_or_more(double p)
    {
        Assert.Equal(0.0, GaussianTail.SigmaFromProbability(p));
    }

    [Fact]
    public void Out_of_range_probabilities_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => GaussianTail.InverseQ(0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => GaussianTail.SigmaFromProbability(double.NaN));
        Assert.Throws<ArgumentOutOfRangeException>(() => GaussianTail.SigmaFromProbability(1.5));
    }
}
