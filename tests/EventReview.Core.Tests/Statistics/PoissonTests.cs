using EventReview.Core.Statistics;

namespace EventReview.Core.Tests.Statistics;

public class PoissonTests
{
    [Theory]
    [InlineData(0, 2.5)]
    [InlineData(1, 2.5)]
    [InlineData(3, 2.5)]
    [InlineData(7, 0.3)]
    [InlineData(12, 11.0)]
    public void At_least_k_matches_the_summed_Poisson_formula(int k, double mu)
    {
        // Poisson formula (textbook): P(N >= k) = 1 - sum_{j<k} e^-mu mu^j / j!
        var below = 0.0;
        var term = Math.Exp(-mu);
        for (var j = 0; j < k; j++)
        {
            below += term;
            term *= mu / (j + 1);
        }

        Assert.Equal(1 - below, Poisson.AtLeast(k, mu), 1e-12);
    }

    [Fact]
    public void At_least_k_keeps_its_digits_far_in_the_tail()
    {
        // Oracle: the upper tail summed term by term in log space (no cancellation), textbook Poisson formula.
        const int k = 40;
        const double mu = 1.0;
        var sum = 0.0;
        for (var j = k; j < k + 60; j++)
        {
            sum += Math.Exp((j * Math.Log(mu)) - mu - MathNet.Numerics.SpecialFunctions.FactorialLn(j));
        }

        var p = Poisson.AtLeast(k, mu);
        Assert.True(p > 0);
        Assert.Equal(1.0, p / sum, 1e-9);
    }

    [Fact]
    public void At_least_one_with_zero_mean_is_zero_and_at_least_zero_is_one()
    {
        Assert.Equal(0.0, Poisson.AtLeast(1, 0.0));
        Assert.Equal(1.0, Poisson.AtLeast(0, 0.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => Poisson.AtLeast(1, double.NaN));
    }

    [Fact]
    public void Chance_coincidence_equals_one_minus_exp_of_minus_two_w_r()
    {
        // Poisson formula: P(at least one event in 2w) = 1 - exp(-2 w R)
        Assert.Equal(1 - Math.Exp(-2 * 1.0 * (5.0 / 3600)), Poisson.ChanceCoincidence(1.0, 5.0 / 3600), 1e-15);
        Assert.Equal(2e-12 - 2e-24, Poisson.ChanceCoincidence(1e-6, 1e-6), 1e-27); // 1 - exp(-x) = x - x^2/2 + ..., x = 2e-12
        Assert.Equal(Poisson.AtLeast(1, 2 * 0.5 * 0.02), Poisson.ChanceCoincidence(0.5, 0.02), 1e-15);
    }

    [Fact]
    public void Accidental_rate_is_two_tau_r1_r2()
    {
        // Knoll, "Radiation Detection and Measurement", coincidence chapter (from memory): R = 2 tau R1 R2
        Assert.Equal(4.0e-6, Poisson.AccidentalRateHz(0.010, 0.01, 0.02), 1e-18);
    }

    [Fact]
    public void Accidental_rate_agrees_with_a_simulation_of_two_poisson_streams()
    {
        // Knoll (from memory): 2 tau R1 R2 = 4.0e-6 Hz for R1 = 0.01 Hz, R2 = 0.02 Hz, tau = 10 ms; Monte Carlo within 4 sigma.
        const double r1 = 0.01, r2 = 0.02, tau = 0.010, duration = 1e8;
        var random = new Random(20261202);
        var a = Stream(random, r1, duration);
        var b = Stream(random, r2, duration);
        var count = 0;
        var j = 0;
        foreach (var t in a)
        {
            while (j < b.Count && b[j] < t - tau)
            {
                j++;
            }

            if (j < b.Count && b[j] <= t + tau)
            {
                count++;
            }
        }

        var expected = Poisson.AccidentalRateHz(tau, r1, r2) * duration;
        Assert.InRange(count, expected - (4 * Math.Sqrt(expected)), expected + (4 * Math.Sqrt(expected)));
    }

    private static List<double> Stream(Random random, double rate, double duration)
    {
        var list = new List<double>();
        var t = 0.0;
        while (true)
        {
            t += -Math.Log(1 - random.NextDouble()) / rate;
            if (t > duration)
            {
                return list;
            }

            list.Add(t);
        }
    }
}
