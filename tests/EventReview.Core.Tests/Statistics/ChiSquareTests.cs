using EventReview.Core.Statistics;

namespace EventReview.Core.Tests.Statistics;

public class ChiSquareTests
{
    [Theory]
    // Upper quantiles at p = 2.7e-3 (the k = 3 two-sided Gaussian rule): Abramowitz & Stegun table 26.8 (read for the nearest
    // tabulated tail, from memory) and CHECKS.md "Calibrated verdicts" (scipy.stats 1.10, chi2.isf): 9.000 / 11.829 / 14.156 / 16.251 / 18.205.
    [InlineData(1, 8.999861956749697)]
    [InlineData(2, 11.829007011943707)]
    [InlineData(3, 14.15625250054093)]
    [InlineData(4, 16.251171152210592)]
    [InlineData(5, 18.205136741736094)]
    public void Upper_quantile_at_the_three_sigma_rule_matches_the_table(int dof, double expected)
    {
        Assert.Equal(expected, ChiSquare.UpperQuantile(2.7e-3, dof), 1e-9);
        Assert.Equal(2.7e-3, ChiSquare.UpperTail(expected, dof), 1e-12);
    }

    [Theory]
    // CHECKS.md "Calibrated verdicts": P(X >= 30) for 1 / 2 / 3 dof = 4.320e-8 / 3.059e-7 / 1.380e-6 (scipy.stats 1.10, chi2.sf).
    [InlineData(1, 4.3204630578274955e-08)]
    [InlineData(2, 3.0590232050182594e-07)]
    [InlineData(3, 1.3800570312932553e-06)]
    public void Upper_tail_far_out_keeps_its_relative_accuracy(int dof, double expected)
    {
        Assert.Equal(expected, ChiSquare.UpperTail(30, dof), expected * 1e-9);
    }

    [Fact]
    public void One_degree_of_freedom_is_the_two_sided_gaussian_tail()
    {
        // Identity: chi2(1) at x = z^2 equals 2 Q(z).
        foreach (var z in new[] { 0.5, 1.0, 2.0, 3.0, 4.5 })
        {
            Assert.Equal(2 * GaussianTail.Q(z), ChiSquare.UpperTail(z * z, 1), 1e-14 + (1e-10 * GaussianTail.Q(z)));
        }
    }

    [Fact]
    public void Bad_arguments_are_refused_and_edges_are_defined()
    {
        Assert.Equal(1.0, ChiSquare.UpperTail(0, 3));
        Assert.Equal(1.0, ChiSquare.UpperTail(-2, 3));
        Assert.True(double.IsNaN(ChiSquare.UpperTail(double.NaN, 2)));
        Assert.Throws<ArgumentOutOfRangeException>(() => ChiSquare.UpperTail(1, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => ChiSquare.UpperQuantile(0, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => ChiSquare.UpperQuantile(1, 1));
    }
}
