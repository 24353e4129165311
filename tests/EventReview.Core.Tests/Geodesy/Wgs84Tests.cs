using EventReview.Core.Geodesy;

namespace EventReview.Core.Tests.Geodesy;

public class Wgs84Tests
{
    private const double Lat = 53 + (48 / 60.0) + (33.820 / 3600.0);
    private const double Lon = 2 + (7 / 60.0) + (46.380 / 3600.0);

    [Fact]
    public void Geodetic_to_ecef_matches_the_epsg_worked_example()
    {
        var p = Wgs84.ToEcef(Lat, Lon, 73.0);

        // EPSG Guidance Note 7-2, geographic/geocentric worked example (3rd decimal from memory).
        Assert.Equal(3771793.968, p.X, 0.001);
        Assert.Equal(140253.342, p.Y, 0.001);
        Assert.Equal(5124304.349, p.Z, 0.001);
    }

    [Fact]
    public void Ecef_to_geodetic_returns_the_epsg_example_input()
    {
        // EPSG Guidance Note 7-2 worked example, inverse direction.
        var g = Wgs84.FromEcef(new Vector3(3771793.968, 140253.342, 5124304.349));

        Assert.Equal(Lat, g.LatitudeDegrees, 1e-8);
        Assert.Equal(Lon, g.LongitudeDegrees, 1e-8);
        Assert.Equal(73.0, g.HeightMeters, 0.001);
    }

    [Theory]
    [InlineData(53.809394444, 2.129550000, 73.0)]
    [InlineData(-33.5, -70.25, 2500.0)]
    [InlineData(0.0, 179.9, -30.0)]
    [InlineData(89.9999, 45.0, 100.0)]
    [InlineData(-89.0, -120.0, 8000.0)]
    public void Geodetic_ecef_round_trip_is_exact_to_1e9_degrees_and_a_millimetre(double lat, double lon, double h)
    {
        var back = Wgs84.FromEcef(Wgs84.ToEcef(lat, lon, h));

        // Round trip (identity), tolerance from CHECKS.md.
        Assert.Equal(lat, back.LatitudeDegrees, 1e-9);
        Assert.Equal(lon, back.LongitudeDegrees, 1e-9);
        Assert.Equal(h, back.HeightMeters, 0.001);
    }

    [Fact]
    public void Latitude_outside_range_is_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Wgs84.ToEcef(91, 0, 0));
    }
}
