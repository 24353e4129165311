using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Core.Timing;

namespace EventReview.Core.Tests.Timing;

public class TimingCheckTests
{
    private static readonly Site[] Network =
    [
        new("KX", "Site KX", 44, -101, 100, 62, 152, 1e-4),
        new("MV", "Site MV", 19, -71, 0, 117, 207, 1e-4),
        new("TQ", "Site TQ", -12, -52, 400, 148, 238, 2e-4),
    ];

    private static readonly GpsTime T0 = GpsTime.FromSeconds(1400000000.5m);

    [Fact]
    public void A_pair_within_the_light_travel_time_is_consistent_with_the_rule_stated()
    {
        var result = TimingCheck.Run(Network, [new SiteArrival("KX", T0), new SiteArrival("MV", T0.AddSeconds(5e-3))], TimingOptions.Default);
        var pair = Assert.Single(result.Pairs);
        var baseline = Baseline.Between(Network[0], Network[1]);

        Assert.Equal("consistent", result.Verdict);
        Assert.Equal(5e-3, pair.ObservedSeconds, 1e-12);
        Assert.Equal(baseline.LightTravelSeconds, pair.LightTravelSeconds, 1e-15);
        Assert.Equal(Math.Sqrt(2) * 1e-4, pair.CombinedSigmaSeconds, 1e-15);
        Assert.Equal(baseline.LightTravelSeconds + (3 * Math.Sqrt(2) * 1e-4), pair.AllowedSeconds, 1e-15);
        Assert.Equal(pair.AllowedSeconds - 5e-3, pair.MarginSeconds, 1e-15);
        Assert.StartsWith("allowed = light-travel ", pair.Rule);
        Assert.Contains("3σ × 0.141 ms", pair.Rule);
        Assert.NotNull(pair.RingAngleDegrees);
        Assert.Empty(result.Sky);
    }

    [Fact]
    public void A_pair_beyond_the_window_is_inconsistent_and_has_no_ring()
    {
        var result = TimingCheck.Run(Network, [new SiteArrival("KX", T0), new SiteArrival("MV", T0.AddSeconds(-20e-3))], TimingOptions.Default);

        Assert.Equal("inconsistent", result.Verdict);
        Assert.False(result.Pairs[0].Consistent);
        Assert.True(result.Pairs[0].MarginSeconds < 0);
        Assert.Null(result.Pairs[0].RingAngleDegrees);
    }

    [Fact]
    public void The_earliest_arrival_is_given_in_utc_with_gmst()
    {
        var early = GpsTime.FromSeconds(1167264017.5m);
        var result = TimingCheck.Run(Network, [new SiteArrival("MV", early.AddSeconds(3e-3)), new SiteArrival("KX", early)], TimingOptions.Default);

        // ref (astropy, CHECKS.md): GPS 1167264017 is the leap second 2016-12-31T23:59:60.
        Assert.Equal("2016-12-31T23:59:60.500000Z", result.Utc);
        Assert.Equal("1167264017.5", result.EarliestArrivalGps);
        Assert.InRange(result.GmstDegrees, 0, 360);
    }

    [Fact]
    public void Three_sites_give_two_mirror_solutions_with_ra_dec_of_the_true_direction()
    {
        var n = new Vector3(0.2, -0.7, 0.5).Normalized();
        var arrivals = Network.Select(s => new SiteArrival(s.Code,
            T0.AddSeconds(-Vector3.Dot(n, SiteGeometry.Position(s)) / PhysicalConstants.SpeedOfLightMetersPerSecond))).ToArray();

        var result = TimingCheck.Run(Network, arrivals, TimingOptions.Default);

        Assert.Equal("consistent", result.Verdict);
        Assert.Equal(2, result.Sky.Count);
        Assert.True(result.RingsMeet);
        var gmst = result.GmstDegrees;
        var expected = SkyFrame.ToEquatorial(n, gmst);
        Assert.Contains(result.Sky, s => Math.Abs(s.RaDegrees - expected.RaDegrees) < 1e-4 && Math.Abs(s.DecDegrees - expected.DecDegrees) < 1e-4);
        Assert.True(result.Sky[0].ChiSquare <= result.Sky[1].ChiSquare); // best (smallest chi-square) first
    }

    [Fact]
    public void Unknown_site_code_is_rejected_naming_the_code()
    {
        var ex = Assert.Throws<ArgumentException>(() =>
            TimingCheck.Run(Network, [new SiteArrival("KX", T0), new SiteArrival("ZZ", T0)], TimingOptions.Default));
        Assert.Contains("ZZ", ex.Message);
    }

    [Fact]
    public void Duplicate_arrivals_and_a_single_arrival_are_rejected()
    {
        var dup = Assert.Throws<ArgumentException>(() =>
            TimingCheck.Run(Network, [new SiteArrival("KX", T0), new SiteArrival("kx", T0)], TimingOptions.Default));
        Assert.Contains("Duplicate", dup.Message);
        Assert.Throws<ArgumentException>(() => TimingCheck.Run(Network, [new SiteArrival("KX", T0)], TimingOptions.Default));
    }

    [Fact]
    public void Non_finite_numbers_and_spread_beyond_the_guard_are_rejected()
    {
        Assert.Throws<ArgumentException>(() =>
            TimingCheck.Run(Network, [new SiteArrival("KX", T0, double.NaN), new SiteArrival("MV", T0)], TimingOptions.Default));
        Assert.Throws<ArgumentException>(() =>
            TimingCheck.Run(Network, [new SiteArrival("KX", T0), new SiteArrival("MV", T0)], new TimingOptions(double.PositiveInfinity)));
        var ex = Assert.Throws<ArgumentException>(() =>
            TimingCheck.Run(Network, [new SiteArrival("KX", T0), new SiteArrival("MV", T0.AddSeconds(5))], new TimingOptions(3, 1.0)));
        Assert.Contains("maxArrivalSpreadSeconds", ex.Message);
    }

    [Fact]
    public void Running_twice_gives_the_same_result()
    {
        SiteArrival[] arrivals = [new("KX", T0), new("MV", T0.AddSeconds(2e-3)), new("TQ", T0.AddSeconds(-11e-3))];
        var a = System.Text.Json.JsonSerializer.Serialize(TimingCheck.Run(Network, arrivals, TimingOptions.Default));
        var b = System.Text.Json.JsonSerializer.Serialize(TimingCheck.Run(Network, arrivals, TimingOptions.Default));

        Assert.Equal(a, b);
    }
}
