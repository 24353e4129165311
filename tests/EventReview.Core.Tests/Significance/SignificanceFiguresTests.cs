using EventReview.Core.Significance;

namespace EventReview.Core.Tests.Significance;

public class SignificanceFiguresTests
{
    [Fact]
    public void Three_louder_in_1e7_s_over_1e6_s_gives_the_reference_far_fap_and_sigma()
    {
        var f = SignificanceFigures.Compute(100, 3, 1e7, 1e6);
        Assert.Equal(3e-7, f.FarHz, 1e-20);          // ref: 3 / 1e7
        Assert.Equal(0.2591817793, f.Fap, 1e-9);     // ref: 1 - exp(-0.3)
        Assert.Equal(0.645870, f.Sigma, 5e-7);       // ref (scipy.stats.norm.isf(0.2591817793))
        Assert.False(f.FarIsBound);
    }

    [Fact]
    public void No_louder_background_gives_a_ninety_percent_bound_of_2_3_over_the_background_time()
    {
        var f = SignificanceFigures.Compute(10, 0, 2e8, 1e6);
        Assert.True(f.FarIsBound);
        Assert.True(f.FapIsBound);
        Assert.True(f.SigmaIsBound);
        Assert.Equal(0.9, f.BoundConfidence);
        Assert.Equal(2.3026 / 2e8, f.FarHz, 1e-13); // CHECKS.md: 2.3026 / T at 90 % (Gehrels 1986, table 1, from memory)
        Assert.Equal(1 - Math.Exp(-1.151292546497023e-2), f.Fap, 1e-15); // 1 - exp(-FAR T_obs)
        Assert.Null(SignificanceFigures.Compute(10, 3, 2e8, 1e6).BoundConfidence);
    }

    [Fact]
    public void A_common_background_gives_zero_sigma()
    {
        var f = SignificanceFigures.Compute(1000, 1000, 1e6, 1e6);
        Assert.True(f.Fap > 0.5);
        Assert.Equal(0.0, f.Sigma);
    }
}
