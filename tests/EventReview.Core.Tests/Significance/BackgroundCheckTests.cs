using EventReview.Core.Significance;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Significance;

public class BackgroundCheckTests
{
    private const long Origin = 1_300_000_000L * GpsTime.NanosecondsPerSecond;

    [Fact]
    public void Three_sites_give_the_pairs_the_triple_and_a_joint_figure_that_sums_every_type()
    {
        var (sites, arrival) = ThreeSites(seed: 4);
        var plans = Plans(("AA", "BB", 12.0), ("AA", "CC", 15.0), ("BB", "CC", 11.0));
        var settings = new BackgroundCheckSettings { StepSeconds = 3, Slides = 300, RemoveCandidateTriggers = true, CandidateTime = arrival, TripleStatistic = Math.Sqrt(3 * 10.0 * 10.0) };

        var result = BackgroundCheck.Run(sites, plans, settings);

        Assert.Equal(3, result.Pairs.Count);
        var triple = Assert.IsType<TripleBackgroundResult>(result.Triple);
        Assert.Equal([12.0, 15.0, 11.0], triple.WindowsMs);
        var joint = Assert.IsType<JointSignificanceResult>(result.Joint);
        Assert.Equal(4, joint.Types.Count);
        Assert.Equal(joint.Judgement.Verdict, result.Judgement.Verdict);

        // Each pair's count at the triple's statistic equals a separate run of that pair at that statistic (oracle).
        foreach (var p in result.Pairs)
        {
            var direct = TimeSlideBackground.Run(sites[p.Plan.SiteA], sites[p.Plan.SiteB], BackgroundCheck.Options(p.Plan, settings, null) with { CandidateStatistic = triple.CandidateStatistic });
            Assert.Equal(direct.Louder, p.Result.LouderThanJoint);
            Assert.Equal(direct.Louder, joint.Types.Single(t => t.Name == p.Plan.Name).Louder);
        }

        Assert.Equal(triple.Figures.Louder, joint.Types.Single(t => t.Name == "AA–BB–CC").Louder);
        Assert.True(joint.Figures.FarHz >= triple.Figures.FarHz);
        Assert.NotNull(triple.WithoutCandidateTriggers);
    }

    [Fact]
    public void Two_sites_give_the_pair_band_and_no_joint_figure()
    {
        var (sites, arrival) = ThreeSites(seed: 5);
        sites.Remove("CC");
        var result = BackgroundCheck.Run(sites, Plans(("AA", "BB", 12.0)), new BackgroundCheckSettings { StepSeconds = 3, Slides = 300, CandidateTime = arrival });
        Assert.Null(result.Triple);
        Assert.Null(result.Joint);
        Assert.Equal(result.Pairs[0].Judgement, result.Judgement);
        Assert.NotEqual(Verdict.Consistent, result.Judgement.Verdict);
    }

    [Fact]
    public void A_step_not_much_longer_than_a_window_is_refused_naming_the_pair()
    {
        var (sites, _) = ThreeSites(seed: 6);
        var ex = Assert.Throws<ArgumentException>(() => BackgroundCheck.Run(sites, Plans(("AA", "BB", 500.0)), new BackgroundCheckSettings { StepSeconds = 3, Slides = 10 }));
        Assert.Contains("AA–BB", ex.Message, StringComparison.Ordinal);
    }

    private static IReadOnlyList<BackgroundPairPlan> Plans(params (string A, string B, double WindowMs)[] pairs) =>
        [.. pairs.Select(p => new BackgroundPairPlan(p.A, p.B, null, p.WindowMs, "given", null, "zero lag"))];

    // Three sites over 1e5 s, Poisson noise triggers at 0.05 Hz, and a loud candidate seen by all three near 5e4 s.
    private static (Dictionary<string, SiteTriggers> Sites, GpsTime Arrival) ThreeSites(int seed)
    {
        var rng = new Random(seed);
        var arrival = new GpsTime(Origin + 50_000_000_000_000);
        var sites = new Dictionary<string, SiteTriggers>();
        foreach (var (code, offset) in new[] { ("AA", 0L), ("BB", 4_000_000L), ("CC", -6_000_000L) })
        {
            var triggers = TimeSlideBackgroundTests.PoissonTriggers(rng, 0.05, 1e5).Append(new Trigger(new GpsTime(arrival.Nanoseconds + offset), 10));
            sites[code] = SiteTriggers.Create(code, triggers, [new Segment(new GpsTime(Origin), new GpsTime(Origin + 100_000_000_000_000))]);
        }

        return (sites, arrival);
    }
}
