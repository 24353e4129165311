using EventReview.Core.Time;

namespace EventReview.Core.Tests.Time;

public class LeapSecondNoticeTests
{
    [Fact]
    public void A_covered_instant_with_a_current_table_gives_utc_and_no_warning()
    {
        // GPS 1167264018 = 2017-01-01T00:00:00 UTC (CHECKS.md, astropy Time format gps)
        var table = LeapSecondTable.Bundled;
        var n = LeapSecondNotice.For(new GpsTime(1167264018L * GpsTime.NanosecondsPerSecond), table.ExpiresUtc.AddDays(-30).ToDateTime(TimeOnly.MinValue, DateTimeKind.Utc), table);
        Assert.StartsWith("2017-01-01T00:00:00", n.Utc, StringComparison.Ordinal);
        Assert.False(n.TableStale);
        Assert.False(n.BeyondTableExpiry);
        Assert.Null(n.Warning);
        Assert.Equal(table.ExpiresUtc.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture), n.TableExpires);
    }

    [Fact]
    public void A_stale_table_or_an_instant_beyond_it_gives_a_warning()
    {
        var table = LeapSecondTable.Bundled;
        var after = table.ExpiresUtc.AddDays(10).ToDateTime(TimeOnly.MinValue, DateTimeKind.Utc);
        var stale = LeapSecondNotice.For(new GpsTime(1167264018L * GpsTime.NanosecondsPerSecond), after, table);
        Assert.True(stale.TableStale);
        Assert.Contains("expired", stale.Warning, StringComparison.Ordinal);
        var beyond = LeapSecondNotice.For(GpsUtc.FromUtc(after, table), after.AddDays(-100), table);
        Assert.True(beyond.BeyondTableExpiry);
        Assert.Contains("off by a leap second", beyond.Warning, StringComparison.Ordinal);
    }
}
