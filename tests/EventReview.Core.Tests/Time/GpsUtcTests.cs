using EventReview.Core.Time;

namespace EventReview.Core.Tests.Time;

public class GpsUtcTests
{
    [Theory]
    [InlineData(0L, "1980-01-06T00:00:00.000Z")] // definition of the GPS epoch
    [InlineData(1000000000L, "2011-09-14T01:46:25.000Z")] // ref (astropy Time, format gps)
    [InlineData(1167264017L, "2016-12-31T23:59:60.000Z")] // ref: the leap second itself
    [InlineData(1167264018L, "2017-01-01T00:00:00.000Z")] // ref
    [InlineData(1480204818L, "2026-12-02T00:00:00.000Z")] // ref
    public void Gps_seconds_convert_to_the_reference_utc(long gps, string utc)
    {
        var instant = GpsUtc.ToUtc(GpsTime.FromSeconds((decimal)gps));

        Assert.Equal(utc, instant.ToString());
    }

    [Theory]
    [InlineData(0L, "1980-01-06T00:00:00Z")]
    [InlineData(1000000000L, "2011-09-14T01:46:25Z")]
    [InlineData(1167264018L, "2017-01-01T00:00:00Z")]
    [InlineData(1480204818L, "2026-12-02T00:00:00Z")]
    public void Utc_converts_back_to_the_reference_gps_seconds(long gps, string utc)
    {
        Assert.True(UtcInstant.TryParse(utc, out var instant));

        // Same reference rows as above (astropy Time, format gps).
        Assert.Equal(gps * GpsTime.NanosecondsPerSecond, GpsUtc.FromUtc(instant).Nanoseconds);
    }

    [Fact]
    public void Leap_second_is_shown_as_second_60_and_round_trips_with_its_fraction()
    {
        var gps = GpsTime.FromSeconds(1167264017.25m);
        var utc = GpsUtc.ToUtc(gps);

        Assert.True(utc.IsLeapSecond);
        Assert.Equal("2016-12-31T23:59:60.250Z", utc.ToString());
        Assert.Equal(gps, GpsUtc.FromUtc(utc));
        Assert.True(UtcInstant.TryParse("2016-12-31T23:59:60.25Z", out var parsed));
        Assert.Equal(gps, GpsUtc.FromUtc(parsed));
    }

    [Fact]
    public void Seconds_on_both_sides_of_the_leap_second_are_ordinary()
    {
        // ref: 1167264016 is 23:59:59 (GPS-UTC 17 s), 1167264018 is midnight (18 s).
        Assert.Equal("2016-12-31T23:59:59.000Z", GpsUtc.ToUtc(GpsTime.FromSeconds(1167264016m)).ToString());
        Assert.False(GpsUtc.ToUtc(GpsTime.FromSeconds(1167264018m)).IsLeapSecond);
    }

    [Theory]
    [InlineData(46828801L)]
    [InlineData(78364802L)]
    [InlineData(109900803L)]
    [InlineData(173059204L)]
    [InlineData(252028805L)]
    [InlineData(315187206L)]
    [InlineData(346723207L)]
    [InlineData(393984008L)]
    [InlineData(425520009L)]
    [InlineData(457056010L)]
    [InlineData(504489611L)]
    [InlineData(551750412L)]
    [InlineData(599184013L)]
    [InlineData(820108814L)]
    [InlineData(914803215L)]
    [InlineData(1025136016L)]
    [InlineData(1119744017L)]
    [InlineData(1167264018L)]
    public void Each_iers_midnight_follows_a_leap_second(long gps)
    {
        // IERS TAI-UTC table as GPS seconds (CHECKS.md): this second is 00:00:00 UTC, the one before is 23:59:60.
        var midnight = GpsUtc.ToUtc(GpsTime.FromSeconds((decimal)gps));
        var leap = GpsUtc.ToUtc(GpsTime.FromSeconds((decimal)(gps - 1)));

        Assert.Equal(TimeSpan.Zero, midnight.DateTimeUtc.TimeOfDay);
        Assert.False(midnight.IsLeapSecond);
        Assert.True(leap.IsLeapSecond);
        Assert.EndsWith("T23:59:60.000Z", leap.ToString());
        Assert.Equal(gps * GpsTime.NanosecondsPerSecond, GpsUtc.FromUtc(midnight.DateTimeUtc).Nanoseconds);
    }

    [Fact]
    public void A_second_60_on_a_day_without_leap_second_is_rejected()
    {
        Assert.True(UtcInstant.TryParse("2020-06-30T23:59:60Z", out var instant));
        Assert.Throws<ArgumentException>(() => GpsUtc.FromUtc(instant));
    }

    [Fact]
    public void Nanoseconds_survive_the_round_trip_to_100_ns()
    {
        var gps = GpsTime.FromSeconds(1400000000.1234567m);
        Assert.Equal(gps, GpsUtc.FromUtc(GpsUtc.ToUtc(gps)));
    }
}
