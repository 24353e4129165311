using EventReview.Core.Antenna;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Timing;

namespace EventReview.Core.Tests.Antenna;

public class AntennaCheckTests
{
    [Fact]
    public void The_true_sign_and_ratio_are_allowed_on_the_ring_of_a_simulated_two_site_event()
    {
        Site[] sites = [new("KX", "Site KX", 44, -101, 100, 62, 152, 1e-4), new("MV", "Site MV", 19, -71, 0, 117, 207, 1e-4)];
        var n = new EventReview.Core.Geodesy.Vector3(0.3, 0.4, 0.5).Normalized();
        var projection = NetworkProjection.Project(sites, n, 0.4);
        var t0 = EventReview.Core.Time.GpsTime.FromSeconds(1400000000m);
        var timing = TimingCheck.Run(sites, projection.Select(p => new SiteArrival(p.Code, t0.AddSeconds(p.DelaySeconds))).ToArray(), TimingOptions.Default);

        // Face-on source (cos ι = 1): amplitude |F+ + i F×| per site, sign of F+a F+b + F×a F×b.
        double Amp(SiteProjection p) => Math.Sqrt((p.FPlus * p.FPlus) + (p.FCross * p.FCross));
        var sign = Math.Sign((projection[0].FPlus * projection[1].FPlus) + (projection[0].FCross * projection[1].FCross));
        var result = AntennaCheck.ForPair(sites, timing, "KX", "MV", new AntennaObservation(sign, Amp(projection[1]) / Amp(projection[0])));

        Assert.Equal("consistent", result.Verdict);
        Assert.InRange(result.FractionAllowingSignAndRatio, 1.0 / 72, 1.0);
        Assert.Equal(72, result.DirectionCount);
    }
}
