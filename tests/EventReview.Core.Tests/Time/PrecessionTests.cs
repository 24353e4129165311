using EventReview.Core.Time;

namespace EventReview.Core.Tests.Time;

public class PrecessionTests
{
    private const double J2000Jd = 2451545.0;

    [Theory]
    // ref (pyerfa 2.0, the ERFA library shipped with astropy 5.2: erfa.pmat76(jd, 0), the IAU 1976 precession matrix, applied to
    // the unit vector of (ra, dec)): RA, Dec at the date, and the angle between the two directions. (astropy's FK5-to-FK5
    // transform uses a newer precession model and differs by about 0.1″.)
    [InlineData(41.054063, 49.227750, 2462088.69, 41.547214370934974, 49.34848310986081, 0.34357177853567805)]
    [InlineData(10.0, -30.0, 2460448.2, 10.298562629942962, -29.86641864150256, 0.2911847241746671)]
    [InlineData(200.0, 60.0, 2457754.5, 200.1616436432482, 59.9111053877095, 0.12021632265000014)]
    [InlineData(300.0, -85.0, 2461000.0, 301.7352143716262, -84.92605533866823, 0.16933729825693486)]
    public void Precession_from_j2000_matches_the_reference_library(double ra, double dec, double jd, double raDate, double decDate, double separation)
    {
        double t = (jd - J2000Jd) / 36525.0;

        var date = Precession.FromJ2000(new EquatorialDirection(ra, dec), t);
        var back = Precession.ToJ2000(date, t);

        Assert.Equal(raDate, date.RaDegrees, 1e-7);
        Assert.Equal(decDate, date.DecDegrees, 1e-7);
        Assert.Equal(ra, back.RaDegrees, 1e-9);
        Assert.Equal(dec, back.DecDegrees, 1e-9);
        Assert.Equal(separation, Precession.OffsetDegrees(date, t), 1e-6);
    }

    [Fact]
    public void Meeus_example_21b_is_reproduced_to_its_printed_precision()
    {
        // Meeus, "Astronomical Algorithms", 2nd ed., example 21.b (theta Persei, proper motion already applied), from memory:
        // J2000 RA 41.054063°, Dec +49.227750° -> at JD 2462088.69: RA 2h46m11.331s = 41.547213°, Dec +49°20'54.54" = 49.348483°.
        var date = Precession.FromJ2000(new EquatorialDirection(41.054063, 49.227750), (2462088.69 - J2000Jd) / 36525.0);

        Assert.Equal(41.547213, date.RaDegrees, 1e-5);
        Assert.Equal(49.348483, date.DecDegrees, 1e-5);
    }

    [Fact]
    public void The_offset_is_zero_at_j2000_and_grows_with_time()
    {
        var d = new EquatorialDirection(123.4, 12.3);
        Assert.Equal(0, Precession.OffsetDegrees(d, 0), 1e-12);
        Assert.True(Precession.OffsetDegrees(d, 0.25) > Precession.OffsetDegrees(d, 0.1));
        Assert.Equal(0.25, Precession.CenturiesSinceJ2000(new DateTime(2025, 1, 1, 6, 0, 0, DateTimeKind.Utc)), 1e-3);
    }
}
