using EventReview.Core.Significance;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Significance;

public class SignificanceBandTests
{
    [Fact]
    public void Measured_figures_give_their_band_as_a_neutral_statement()
    {
        // 3 louder in 1e7 s over 1e6 s: 0.645870 sigma (CHECKS.md, scipy.stats.norm.isf)
        var low = SignificanceBand.Judge(SignificanceFigures.Compute(100, 3, 1e7, 1e6), 1e7, 1e6, "AB–KP");
        Assert.Equal(Verdict.BelowThreeSigma, low.Verdict);
        Assert.Equal(VerdictTone.Neutral, low.Tone);
        Assert.DoesNotContain("consistent", low.Reason, StringComparison.Ordinal);
        Assert.Contains("FAR 3×10⁻⁷ Hz", low.Reason, StringComparison.Ordinal);

        Assert.Equal(Verdict.ThreeToFiveSigma, SignificanceBand.Of(4.2, isLowerBound: false));
        Assert.Equal(Verdict.FiveSigmaOrMore, SignificanceBand.Of(5.0, isLowerBound: false));
        Assert.Equal(Verdict.FiveSigmaOrMore, SignificanceBand.Of(5.3, isLowerBound: true)); // a bound at or above 5 is above 5
        Assert.Equal(Verdict.AtLeastThreeSigma, SignificanceBand.Of(3.4, isLowerBound: true));
    }

    [Fact]
    public void A_bound_is_written_as_a_bound_and_the_old_one_over_t_bound_overstated_it()
    {
        // Nothing louder in 1e9 s over T_obs 1e6 s. The old bound 1 / T_bg gave FAP 1e-3, 3.09 sigma: "3-5 sigma".
        var old = 1 - Math.Exp(-1e-3);
        Assert.True(EventReview.Core.Statistics.GaussianTail.SigmaFromProbability(old) > 3);

        // The 90 % bound 2.3026 / T_bg gives FAP < 2.3e-3, >= 2.83 sigma: the background is too short to say 3 sigma.
        var f = SignificanceFigures.Compute(500, 0, 1e9, 1e6);
        var j = SignificanceBand.Judge(f, 1e9, 1e6, "AB–KP");
        Assert.Equal(Verdict.Concern, j.Verdict);
        Assert.Contains("FAR < 2.3×10⁻⁹ Hz", j.Reason, StringComparison.Ordinal);
        Assert.Contains("90 % upper bound", j.Reason, StringComparison.Ordinal);
        Assert.Contains("FAP < 0.0023", j.Reason, StringComparison.Ordinal);
        Assert.Contains("≥ 2.83σ", j.Reason, StringComparison.Ordinal);
        Assert.Equal("background too short", SignificanceBand.Word(f.Sigma, f.SigmaIsBound));

        // With ten times the background both agree that it is past 3 sigma; the new one says "at least".
        var longer = SignificanceFigures.Compute(5000, 0, 1e10, 1e6);
        Assert.Equal(Verdict.AtLeastThreeSigma, SignificanceBand.Judge(longer, 1e10, 1e6, "AB–KP").Verdict);
    }

    [Fact]
    public void The_background_needed_for_three_sigma_follows_from_the_ninety_percent_bound()
    {
        // T_bg / T_obs = 2.3026 / -ln(1 - Q(3)), Q(3) = 1.34989803163e-3 (A&S table 26.1, from memory)
        var multiple = SignificanceBand.BackgroundMultipleFor(3);
        Assert.Equal(2.302585092994046 / -Math.Log(1 - 1.34989803163e-3), multiple, 1e-6);
        Assert.Equal(3.0, SignificanceBand.MaxReachableSigma(multiple * 1e6, 1e6), 1e-9);
    }

    [Fact]
    public void The_slide_p_value_floor_is_written_with_less_or_equal()
    {
        Assert.Equal("slide p ≤ 2.5×10⁻⁴ (floor 1 / (4,000 slides + 1): no slide as loud)", SignificanceText.SlidePValue(1 / 4001.0, 0, 4000));
        Assert.StartsWith("slide p = 0.00125", SignificanceText.SlidePValue(5 / 4001.0, 4, 4000), StringComparison.Ordinal);
    }

    [Fact]
    public void Joint_significance_sums_the_rates_of_every_coincidence_type()
    {
        var types = new[]
        {
            new CoincidenceTypeBackground("A–B", 2, 1e9, 1e6),
            new CoincidenceTypeBackground("A–C", 0, 2e9, 1e6),
            new CoincidenceTypeBackground("A–B–C", 1, 5e8, 5e5),
        };
        var joint = JointSignificance.Combine(20, types);

        // FAR = 2 / 1e9 + 2.3026 / 2e9 (bound) + 1 / 5e8; expected = sum of FAR_i x T_obs,i (by hand)
        var far = (2 / 1e9) + (2.302585092994046 / 2e9) + (1 / 5e8);
        Assert.Equal(far, joint.Figures.FarHz, 1e-20);
        Assert.True(joint.Figures.FarIsBound);
        var expected = (2 / 1e9 * 1e6) + (2.302585092994046 / 2e9 * 1e6) + (1 / 5e8 * 5e5);
        Assert.Equal(expected, joint.ExpectedFalseAlarms, 1e-15);
        Assert.Equal(1 - Math.Exp(-expected), joint.Figures.Fap, 1e-15);
        // The joint FAR is never below any single type's: summing is the trials factor over types.
        Assert.All(joint.Types, t => Assert.True(joint.Figures.FarHz >= t.FarHz));
        Assert.Contains("Davies et al. 2020", string.Join(" ", joint.Assumptions), StringComparison.Ordinal);
    }
}
