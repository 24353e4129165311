using EventReview.Core.Environment;
using EventReview.Core.Injections;
using EventReview.Core.Statistics;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Environment;

public class VetoSafetyTests
{
    private static readonly GpsTime T0 = GpsTime.FromSeconds(1_300_000_000m);

    [Fact]
    public void Chance_per_injection_is_one_minus_exp_of_minus_r_times_two_w_plus_d()
    {
        // CHECKS.md "Calibrated verdicts": R = 0.25 Hz, w = 1 s, d = 0.2 s -> q = 0.42305 (scipy.stats 1.10)
        Assert.Equal(0.42305, VetoSafety.ChanceProbability(0.25, 1, 0.2), 5e-6);
        Assert.Equal(0.0, VetoSafety.ChanceProbability(0, 1, 0.2));
    }

    [Fact]
    public void A_channel_firing_at_30_of_30_injections_is_unsafe_where_the_old_poisson_count_called_it_safe()
    {
        var (triggers, injections) = CombWithInjections(coupled: true);
        var report = VetoSafety.Evaluate(triggers, injections, new VetoSafetyOptions(WindowSeconds: 1, LiveTimeSeconds: 3066));
        var c = Assert.Single(report.Channels);

        // R is measured away from the injections: 750 comb triggers in 3066 - 30 x 2.2 = 3000 s.
        Assert.Equal(0.25, c.RateHz, 1e-12);
        Assert.Equal(750, c.RateTriggers);
        Assert.Equal(30, c.Coincident);
        Assert.Equal(0.42305, c.ChanceProbabilityPerInjection, 5e-6); // CHECKS.md, scipy.stats 1.10
        Assert.Equal(30 * c.ChanceProbabilityPerInjection, c.Expected, 1e-9);
        Assert.Equal(Math.Pow(c.ChanceProbabilityPerInjection, 30), c.BinomialProbability, 1e-20); // P(K >= 30 | n = 30) = q^30
        Assert.False(c.Safe);
        Assert.Equal(Verdict.VetoUnsafe, c.Judgement.Verdict);
        Assert.Equal(Verdict.VetoUnsafe, report.Judgement.Verdict);

        // The old statistic: coincident injections against a Poisson of mean R_all x sum(2 w + d), R_all counting every
        // trigger. It gives P above the 1e-3 threshold: "safe" for a channel that fires at every injection.
        var oldMean = (780 / 3066.0) * 30 * 2.2;
        Assert.True(Poisson.AtLeast(30, oldMean) > 1e-3, $"old P = {Poisson.AtLeast(30, oldMean)}");
    }

    [Fact]
    public void Both_statistics_agree_on_a_channel_that_ignores_injections()
    {
        var (triggers, injections) = CombWithInjections(coupled: false);
        var c = Assert.Single(VetoSafety.Evaluate(triggers, injections, new VetoSafetyOptions(WindowSeconds: 1, LiveTimeSeconds: 3066)).Channels);
        Assert.Equal(0, c.Coincident);
        Assert.Equal(1.0, c.BinomialProbability);
        Assert.True(c.Safe);
        Assert.Equal(1.0, Poisson.AtLeast(0, 750 / 3066.0 * 66)); // old statistic: safe too
    }

    [Fact]
    public void Both_statistics_agree_that_a_quiet_channel_firing_at_most_injections_is_unsafe()
    {
        // A channel with 5 triggers away from the injections over 1e5 s, firing at 20 of 30 injections.
        var injections = Enumerable.Range(0, 30).Select(m => Injection(1000 + (3000.0 * m), 0.2)).ToList();
        var triggers = Enumerable.Range(0, 5).Select(i => Trigger(500 + (20_000.0 * i)))
            .Concat(injections.Take(20).Select(inj => Trigger(inj.Start.SecondsSince(T0) + 0.1))).ToList();
        var c = Assert.Single(VetoSafety.Evaluate(triggers, injections, new VetoSafetyOptions(WindowSeconds: 1, LiveTimeSeconds: 1e5)).Channels);
        Assert.False(c.Safe);
        Assert.True(Poisson.AtLeast(20, 25 / 1e5 * 30 * 2.2) < 1e-3); // old statistic: unsafe too
    }

    [Fact]
    public void The_deadtime_of_a_veto_is_the_union_of_the_windows_around_its_triggers()
    {
        var (triggers, injections) = CombWithInjections(coupled: true);
        var c = Assert.Single(VetoSafety.Evaluate(triggers, injections, new VetoSafetyOptions(WindowSeconds: 1, LiveTimeSeconds: 3066)).Channels);

        // 750 comb triggers, 4 s apart, each ±1 s: 1500 s; each of the 30 coupled triggers at 100 m + 2.1 s adds [1.1, 3.1]
        // less its 0.4 s overlap with the comb trigger at 100 m + 0.5 s: 1.6 s (identity of interval unions).
        Assert.Equal(1500 + (30 * 1.6), c.DeadtimeSeconds, 1e-6);
        Assert.Equal(c.DeadtimeSeconds / 3066, c.DeadtimeFraction, 1e-12);
    }

    [Fact]
    public void Injections_of_different_durations_use_the_poisson_binomial_and_aborted_ones_do_not_count()
    {
        var injections = new List<InjectionRecord> { Injection(100, 0.2), Injection(300, 5), Injection(500, 0.2) };
        injections.Add(new InjectionRecord("KX", T0.AddSeconds(700), T0.AddSeconds(701), "burst", "w", InjectionStatus.Aborted));
        var triggers = new List<AuxiliaryTrigger> { Trigger(100.1), Trigger(700.5) };
        triggers.AddRange(Enumerable.Range(0, 40).Select(i => Trigger(1000 + (50.0 * i))));
        var c = Assert.Single(VetoSafety.Evaluate(triggers, injections, new VetoSafetyOptions(WindowSeconds: 1, LiveTimeSeconds: 4000)).Channels);
        Assert.Equal(3, c.Injections);
        Assert.Equal(1, c.Coincident);
        var rate = 41 / (4000 - (2.2 + 7 + 2.2)); // the trigger near the aborted injection counts for the rate
        Assert.Equal(rate, c.RateHz, 1e-12);
        double[] q = [VetoSafety.ChanceProbability(rate, 1, 0.2), VetoSafety.ChanceProbability(rate, 1, 5), VetoSafety.ChanceProbability(rate, 1, 0.2)];
        Assert.Equal(1 - ((1 - q[0]) * (1 - q[1]) * (1 - q[2])), c.BinomialProbability, 1e-12); // P(K >= 1), by hand
        Assert.NotNull(c.Note);
    }

    [Fact]
    public void A_channel_whose_rate_cannot_be_measured_is_not_tested()
    {
        var triggers = new[] { Trigger(0) };
        var injections = new[] { Injection(0, 0) };
        var c = Assert.Single(VetoSafety.Evaluate(triggers, injections).Channels);
        Assert.Equal(1, c.Coincident);
        Assert.Null(c.Safe);
        Assert.Equal(Verdict.NotRun, c.Judgement.Verdict);
        Assert.Contains("live time", c.Note);
    }

    // A comb of 750 triggers at 4 j + 0.5 s (0.25 Hz, none inside an injection window) and 30 injections of 0.2 s at
    // 100 m + 2 s; with coupled, one more trigger 0.1 s into each injection.
    private static (List<AuxiliaryTrigger> Triggers, List<InjectionRecord> Injections) CombWithInjections(bool coupled)
    {
        var triggers = Enumerable.Range(0, 750).Select(j => Trigger((4.0 * j) + 0.5)).ToList();
        var injections = Enumerable.Range(0, 30).Select(m => Injection((100.0 * m) + 2, 0.2)).ToList();
        if (coupled)
        {
            triggers.AddRange(injections.Select(i => Trigger(i.Start.SecondsSince(T0) + 0.1)));
        }

        return (triggers, injections);
    }

    private static AuxiliaryTrigger Trigger(double offset) => new("KX", "C", T0.AddSeconds(offset), 6, null, null);

    private static InjectionRecord Injection(double offset, double duration) =>
        new("KX", T0.AddSeconds(offset), T0.AddSeconds(offset + duration), "burst", "w", InjectionStatus.Performed);
}
