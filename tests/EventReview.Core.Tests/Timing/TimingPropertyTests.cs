using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Core.Timing;

namespace EventReview.Core.Tests.Timing;

public class TimingPropertyTests
{
    [Fact]
    public void Simulated_arrivals_always_pass_and_recover_the_direction_or_its_mirror()
    {
        var random = new Random(4242);
        for (var trial = 0; trial < 300; trial++)
        {
            var count = 3 + random.Next(2);
            var sites = Enumerable.Range(0, count).Select(i => new Site(
                $"S{i}", $"Site {i}", (Math.Asin((2 * random.NextDouble()) - 1) * 180 / Math.PI), (360 * random.NextDouble()) - 180,
                random.NextDouble() * 1000, 360 * random.NextDouble(), 360 * random.NextDouble(), 1e-4)).ToArray();
            var n = SkyFrame.ToEcef(360 * random.NextDouble(), Math.Asin((2 * random.NextDouble()) - 1) * 180 / Math.PI, 0);
            var t0 = GpsTime.FromSeconds(1.2e9 + (random.NextDouble() * 3e8));
            var arrivals = NetworkProjection.Project(sites, n, 0).Select(p => new SiteArrival(p.Code, t0.AddSeconds(p.DelaySeconds))).ToArray();

            var result = TimingCheck.Run(sites, arrivals, TimingOptions.Default);

            Assert.True(result.Consistent, $"trial {trial}: {result.SkyNote}");
            Assert.All(result.Pairs, p => Assert.True(p.Consistent));
            var best = result.Sky[0].Direction;
            var plane = Vector3.Cross(SiteGeometry.Position(sites[1]) - SiteGeometry.Position(sites[0]),
                SiteGeometry.Position(sites[2]) - SiteGeometry.Position(sites[0])).Normalized();
            var mirror = n - (2 * Vector3.Dot(n, plane) * plane);
            var found = result.Sky.Any(s => Vector3.AngleBetween(s.Direction, n) < 1e-3)
                || (count == 3 && Vector3.AngleBetween(best, mirror) < 1e-3);
            Assert.True(found, $"trial {trial}: {count} sites, direction not recovered");
            if (count == 4)
            {
                Assert.True(Vector3.AngleBetween(best, n) < 1e-3, $"trial {trial}: four sites should pin the direction");
            }
        }
    }
}
