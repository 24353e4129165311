using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Statistics;
using EventReview.Core.Time;
using EventReview.Core.Timing;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Timing;

/// <summary>The sky-fit chi-square that replaced "RMS residual ≤ k × RMS σ" for four or more sites.</summary>
public class TimingChiSquareTests
{
    // Invented geometry (letters-only codes, positions and orientations of our own); timing uncertainty 0.5 ms each.
    private static readonly Site[] Four =
    [
        new("PA", "Pale Anchor", 52.0, 8.0, 100, 10, 100, 5e-4),
        new("QB", "Quiet Bay", -31.0, 118.0, 20, 45, 135, 5e-4),
        new("RC", "Red Cedar", 38.0, -98.0, 400, 300, 30, 5e-4),
        new("SD", "Salt Dune", 5.0, 30.0, 600, 70, 160, 5e-4),
    ];

    private static readonly GpsTime T0 = GpsTime.FromSeconds(1400000000m);

    private static SiteArrival[] Arrivals(IReadOnlyList<Site> sites, double scale, params double[] errorsSeconds)
    {
        var projection = NetworkProjection.Project(sites, SkyFrame.ToEcef(150, 20, 0), 0);
        return projection.Select((p, i) => new SiteArrival(p.Code, T0.AddSeconds((scale * p.DelaySeconds) + (i < errorsSeconds.Length ? errorsSeconds[i] : 0)))).ToArray();
    }

    /// <summary>The old rule, kept here as the statistic under test: RMS residual of the best direction ≤ 3 × RMS σ.</summary>
    private static bool OldRulePasses(TimingCheckResult r, IReadOnlyList<Site> sites) =>
        r.MinimalResidualSeconds <= 3 * Math.Sqrt(sites.Average(s => s.TimingUncertaintySeconds * s.TimingUncertaintySeconds));

    [Fact]
    public void Four_sites_that_no_direction_fits_pass_every_pair_and_the_old_rms_rule_but_fail_the_chi_square()
    {
        // Every delay shrunk to 60 % of a real direction's: each pair is well inside its light-travel window, but no direction
        // on the sphere gives such small delays at all four sites at once.
        var result = TimingCheck.Run(Four, Arrivals(Four, 0.6), TimingOptions.Default);

        Assert.All(result.Pairs, p => Assert.True(p.Consistent));
        Assert.True(OldRulePasses(result, Four), $"old rule: RMS {result.MinimalResidualSeconds * 1e3:F3} ms ≤ 1.5 ms");
        Assert.Equal(1, result.DegreesOfFreedom); // 4 arrivals − 3
        Assert.True(result.Chi2 > 14, $"chi2 {result.Chi2}");
        Assert.Equal(ChiSquare.UpperTail(result.Chi2!.Value, 1), result.PValue!.Value, 1e-15);
        Assert.True(result.PValue < 2.7e-3);
        Assert.Equal("inconsistent", result.Verdict);
        Assert.Equal(Verdict.Inconsistent, result.Judgement!.Verdict);
        Assert.Contains("no single direction fits", result.Judgement.Reason);
    }

    [Fact]
    public void Four_sites_with_small_timing_errors_pass_both_rules()
    {
        // Errors of about one sigma (0.5 ms) at each site: both statistics agree that one direction fits.
        var result = TimingCheck.Run(Four, Arrivals(Four, 1.0, 3e-4, -4e-4, 2e-4, 5e-4), TimingOptions.Default);

        Assert.True(OldRulePasses(result, Four));
        Assert.Equal("consistent", result.Verdict);
        Assert.True(result.PValue >= 2.7e-3, $"p {result.PValue}");
        Assert.Contains("χ² =", result.Judgement!.Reason);
    }

    [Fact]
    public void Four_sites_with_one_grossly_wrong_time_fail_both_rules()
    {
        var result = TimingCheck.Run(Four, Arrivals(Four, 1.0, 0, 0, 0, 8e-3), TimingOptions.Default);

        Assert.False(OldRulePasses(result, Four));
        Assert.Equal("inconsistent", result.Verdict);
        Assert.True(result.PValue < 2.7e-3);
    }

    [Fact]
    public void The_weighted_fit_finds_the_smallest_chi_square_on_the_sphere()
    {
        // Unequal uncertainties: the fit must weigh each site by 1/σ². Oracle: a plain scan of 200 000 directions.
        Site[] sites = [.. Four.Select((s, i) => new Site(s.Code, s.Name, s.LatitudeDegrees, s.LongitudeDegrees, s.HeightMeters,
            s.XArmAzimuthDegrees, s.YArmAzimuthDegrees, (i + 1) * 3e-4))];
        var arrivals = Arrivals(sites, 0.8, 4e-4, 0, -7e-4, 2e-4);
        var result = TimingCheck.Run(sites, arrivals, TimingOptions.Default);
        var r = sites.Select(SiteGeometry.Position).ToArray();
        var t = arrivals.Select(a => a.Arrival.SecondsSince(T0)).ToArray();
        var sigma = sites.Select(s => s.TimingUncertaintySeconds).ToArray();

        var random = new Random(7);
        double best = double.PositiveInfinity;
        for (int i = 0; i < 200_000; i++)
        {
            double z = (2 * random.NextDouble()) - 1, phi = 2 * Math.PI * random.NextDouble(), rho = Math.Sqrt(1 - (z * z));
            best = Math.Min(best, SkySolver.ChiSquare(r, t, sigma, new Vector3(rho * Math.Cos(phi), rho * Math.Sin(phi), z)));
        }

        Assert.True(result.Chi2 <= best + 1e-9, $"fit {result.Chi2} vs scan {best}");
        Assert.True(best - result.Chi2 < 0.05 * best + 1e-3, $"fit {result.Chi2} vs scan {best}");
    }

    [Fact]
    public void Three_sites_whose_rings_meet_have_no_residual_test()
    {
        var three = Four.Take(3).ToArray();
        var result = TimingCheck.Run(three, Arrivals(three, 1.0), TimingOptions.Default);

        Assert.Equal("consistent", result.Verdict);
        Assert.Equal(0, result.DegreesOfFreedom);
        Assert.Null(result.PValue);
        Assert.Contains("no residual test is possible", result.SkyNote);
        Assert.Equal(2, result.Sky.Count);
    }

    [Fact]
    public void Two_sites_report_no_chi_square_and_the_frame_of_the_sky_is_stated()
    {
        var result = TimingCheck.Run(Four, Arrivals(Four, 1.0).Take(2).ToArray(), TimingOptions.Default);
        Assert.Null(result.Chi2);
        Assert.Null(result.DegreesOfFreedom);
        Assert.Equal("mean of date", result.SkyFrame);
        Assert.Contains(result.Assumptions, a => a.Contains("not ICRS", StringComparison.Ordinal));
    }

    [Fact]
    public void Sky_solutions_state_their_offset_from_icrs()
    {
        var three = Four.Take(3).ToArray();
        var result = TimingCheck.Run(three, Arrivals(three, 1.0), TimingOptions.Default);

        // 2024: about 24 years of precession (~50″ a year, a turn about the ecliptic pole): from ~0° near the ecliptic poles up to
        // ~0.34° elsewhere (IAU 1976, see PrecessionTests); the assumptions quote the largest.
        Assert.All(result.Sky, s => Assert.InRange(s.IcrsOffsetDegrees, 0, 0.36));
        Assert.Contains(result.Assumptions, a => a.Contains(result.Sky.Max(s => s.IcrsOffsetDegrees).ToString("0.00", System.Globalization.CultureInfo.InvariantCulture) + "°", StringComparison.Ordinal));
    }

    [Fact]
    public void A_false_alarm_probability_outside_zero_to_one_is_refused()
    {
        var ex = Assert.Throws<ArgumentException>(() => TimingCheck.Run(Four, Arrivals(Four, 1.0), new TimingOptions(3, null, 0)));
        Assert.Contains("falseAlarmProbability", ex.Message);
    }
}
