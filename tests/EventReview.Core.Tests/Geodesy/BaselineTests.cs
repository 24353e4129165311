using EventReview.Core.Geodesy;
using EventReview.Core.Network;

namespace EventReview.Core.Tests.Geodesy;

public class BaselineTests
{
    [Fact]
    public void Light_travel_time_of_3001775_76_m_is_10_012846_ms()
    {
        // d / c with c = 299 792 458 m/s (SI definition).
        Assert.Equal(10.012846e-3, Baseline.TravelSeconds(3_001_775.76), 1e-9);
    }

    [Fact]
    public void Two_sites_about_3000_km_apart_allow_about_10_ms()
    {
        // Two invented sites on the equator, 27 degrees of longitude apart (chord ~2990 km).
        var a = new Site("KX", "Site KX", 0, 0, 0, 0, 90, 1e-4);
        var b = new Site("MV", "Site MV", 0, 27, 0, 0, 90, 1e-4);
        var baseline = Baseline.Between(a, b);

        Assert.InRange(baseline.BaselineMeters, 2.9e6, 3.1e6);

        // Common practice: continental baselines of ~3000 km give a maximum arrival difference of ~10 ms.
        Assert.Equal(10e-3, baseline.LightTravelSeconds, 0.1e-3);
    }

    [Fact]
    public void Baseline_vector_points_from_b_to_a()
    {
        var a = new Site("KX", "Site KX", 10, 20, 0, 0, 90, 1e-4);
        var b = new Site("MV", "Site MV", -9, 47, 100, 0, 90, 1e-4);
        var baseline = Baseline.Between(a, b);

        var expected = SiteGeometry.Position(a) - SiteGeometry.Position(b);
        Assert.Equal(expected, baseline.VectorMeters);
        Assert.Equal(expected.Length, baseline.BaselineMeters, 1e-6);
    }
}
