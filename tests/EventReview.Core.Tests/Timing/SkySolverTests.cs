using EventReview.Core.Geodesy;
using EventReview.Core.Timing;

namespace EventReview.Core.Tests.Timing;

public class SkySolverTests
{
    private static double[] Arrivals(IReadOnlyList<Vector3> r, Vector3 n) =>
        r.Select(p => 0.25 - (Vector3.Dot(n, p) / PhysicalConstants.SpeedOfLightMetersPerSecond)).ToArray();

    [Fact]
    public void Three_sites_recover_the_direction_and_its_mirror_through_the_plane_of_the_sites()
    {
        Vector3[] r = [Wgs84.ToEcef(47, -105, 100), Wgs84.ToEcef(28, -82, 0), Wgs84.ToEcef(41, 22, 50)];
        var n = new Vector3(0.2, -0.7, 0.5).Normalized();
        var normal = Vector3.Cross(r[1] - r[0], r[2] - r[0]).Normalized();
        var mirror = n - (2 * Vector3.Dot(n, normal) * normal);

        var fit = SkySolver.Solve(r, Arrivals(r, n));

        Assert.True(fit.RingsMeet);
        Assert.Equal(2, fit.Solutions.Count);
        var found = fit.Solutions.Select(s => s.Direction).ToArray();

        // Identity (CHECKS.md): the two solutions are n and its mirror, to 1e-8.
        Assert.Contains(found, d => (d - n).Length < 1e-8);
        Assert.Contains(found, d => (d - mirror).Length < 1e-8);
    }

    [Fact]
    public void Four_sites_recover_the_unique_direction_by_least_squares()
    {
        Vector3[] r = [Wgs84.ToEcef(47, -105, 100), Wgs84.ToEcef(28, -82, 0), Wgs84.ToEcef(41, 22, 50), Wgs84.ToEcef(34, 128, 300)];
        var n = new Vector3(-0.4, 0.1, -0.6).Normalized();

        var fit = SkySolver.Solve(r, Arrivals(r, n));

        Assert.Single(fit.Solutions);
        Assert.True((fit.Solutions[0].Direction - n).Length < 1e-8);
        Assert.True(fit.MinimalResidualSeconds < 1e-12);
    }

    [Fact]
    public void Rings_that_do_not_meet_give_one_compromise_and_its_residual()
    {
        Vector3[] r = [Vector3.Zero, new(3_000_000, 0, 0), new(0, 3_000_000, 0)];

        // 9.5 ms on both 3000 km baselines: the two cones about -x and -y are too narrow to cross.
        var fit = SkySolver.Solve(r, [0.0, 9.5e-3, 9.5e-3]);

        Assert.False(fit.RingsMeet);
        Assert.Single(fit.Solutions);
        Assert.True(fit.MinimalResidualSeconds > 1e-4);
        Assert.Equal(fit.MinimalResidualSeconds, SkySolver.Residual(r, [0.0, 9.5e-3, 9.5e-3], fit.Solutions[0].Direction), 1e-15);

        // No other direction does better (coarse scan of the sphere).
        var random = new Random(3);
        for (var i = 0; i < 2000; i++)
        {
            var d = new Vector3(random.NextDouble() - 0.5, random.NextDouble() - 0.5, random.NextDouble() - 0.5).Normalized();
            Assert.True(SkySolver.Residual(r, [0.0, 9.5e-3, 9.5e-3], d) >= fit.MinimalResidualSeconds - 1e-12);
        }
    }
}
