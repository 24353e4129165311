using EventReview.Core.Geodesy;
using EventReview.Core.Network;

namespace EventReview.Core.Tests.Network;

public class NetworkProjectionTests
{
    [Fact]
    public void A_site_facing_the_source_sees_it_before_the_geocentre_by_r_over_c()
    {
        var site = new Site("KX", "Site KX", 0, 0, 0, 0, 90, 1e-4);
        var p = NetworkProjection.Project([site], new Vector3(1, 0, 0), 0)[0];

        // t = t0 - n·r/c with r = a on the equator at longitude 0.
        Assert.Equal(-Wgs84.SemiMajorAxisMeters / PhysicalConstants.SpeedOfLightMetersPerSecond, p.DelaySeconds, 1e-12);

        // Source overhead: |F+|² + |F×|² = 1 (detector-frame row θ = 0).
        Assert.Equal(1.0, (p.FPlus * p.FPlus) + (p.FCross * p.FCross), 1e-12);
    }
}
