using EventReview.Core.Geodesy;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Time;

public class SiderealTests
{
    [Fact]
    public void Gmst_at_1987_04_10_0h_matches_meeus_example_12a()
    {
        var gmst = Sidereal.GreenwichMeanSiderealDegrees(new DateTime(1987, 4, 10, 0, 0, 0, DateTimeKind.Utc));

        // Meeus, Astronomical Algorithms 2nd ed., example 12.a: 13h10m46.3668s.
        Assert.Equal(197.693195, gmst, 1e-6);
    }

    [Fact]
    public void Gmst_at_1987_04_10_19_21_matches_meeus_example_12b()
    {
        var gmst = Sidereal.GreenwichMeanSiderealDegrees(new DateTime(1987, 4, 10, 19, 21, 0, DateTimeKind.Utc));

        // Meeus, Astronomical Algorithms 2nd ed., example 12.b: 8h34m57.0896s.
        Assert.Equal(128.7378734, gmst, 1e-6);
    }

    [Fact]
    public void Earth_fixed_diagonal_at_the_12b_instant_has_the_reference_ra_dec()
    {
        var gmst = Sidereal.GreenwichMeanSiderealDegrees(new DateTime(1987, 4, 10, 19, 21, 0, DateTimeKind.Utc));
        var eq = SkyFrame.ToEquatorial(new Vector3(1, 1, 1), gmst);

        // ref (CHECKS.md, GMST rotation of (1,1,1)/sqrt(3)).
        Assert.Equal(173.7378733, eq.RaDegrees, 1e-6);
        Assert.Equal(35.2643897, eq.DecDegrees, 1e-6);
    }

    [Fact]
    public void Ra_dec_to_earth_fixed_and_back_is_the_identity()
    {
        var n = SkyFrame.ToEcef(301.5, -42.25, 77.7);
        var eq = SkyFrame.ToEquatorial(n, 77.7);

        Assert.Equal(301.5, eq.RaDegrees, 1e-10);
        Assert.Equal(-42.25, eq.DecDegrees, 1e-10);
    }
}
