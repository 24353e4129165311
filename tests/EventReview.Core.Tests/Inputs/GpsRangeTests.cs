using EventReview.Core.Inputs;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Inputs;

public class GpsRangeTests
{
    [Fact]
    public void The_latest_accepted_time_is_ten_years_after_the_leap_second_table_expires()
    {
        // The bundled table expires 2027-06-28, so the horizon is 2037-06-28T00:00:00 UTC. CHECKS.md (ref, astropy): GPS
        // 1480204818 is 2026-12-02T00:00:00 UTC with GPS - UTC = 18 s; 2026-12-02 to 2037-06-28 is 3,861 days (no leap
        // second is in the table after 2017), so the horizon is 1480204818 + 3861 x 86400 = 1813795218.
        Assert.Equal(new DateOnly(2027, 6, 28), LeapSecondTable.Bundled.ExpiresUtc);
        Assert.Equal(1_813_795_218L * GpsTime.NanosecondsPerSecond, GpsRange.Latest.Nanoseconds);
    }

    [Fact]
    public void The_range_starts_just_after_the_gps_epoch_and_ends_just_before_the_horizon()
    {
        Assert.False(GpsRange.Contains(GpsTime.Epoch));
        Assert.True(GpsRange.Contains(new GpsTime(1)));
        Assert.True(GpsRange.Contains(new GpsTime(GpsRange.Latest.Nanoseconds - 1)));
        Assert.False(GpsRange.Contains(GpsRange.Latest));
    }

    [Fact]
    public void A_time_a_few_years_past_the_horizon_is_outside_and_the_message_names_the_dates()
    {
        // GPS 2e9 s is in 2043, six years past the horizon.
        Assert.False(GpsRange.Contains(GpsTime.FromSeconds(2_000_000_000m)));
        Assert.Contains("2037-06-28", GpsRange.Describe(), StringComparison.Ordinal);
        Assert.Contains("1980-01-06", GpsRange.Describe(), StringComparison.Ordinal);
    }
}
