using EventReview.Core.Notifications;

namespace EventReview.Core.Tests.Notifications;

public sealed class DigestScheduleTests
{
    private static DateTimeOffset At(int day, int hour, int minute = 0) => new(2027, 3, day, hour, minute, 0, TimeSpan.Zero);

    [Fact]
    public void The_latest_digest_time_is_today_after_the_hour_and_yesterday_before_it()
    {
        Assert.Equal(At(2, 7), DigestSchedule.LatestAtOrBefore(At(2, 7), 7));
        Assert.Equal(At(2, 7), DigestSchedule.LatestAtOrBefore(At(2, 18), 7));
        Assert.Equal(At(1, 7), DigestSchedule.LatestAtOrBefore(At(2, 6, 59), 7));
        Assert.Equal(At(3, 7), DigestSchedule.Next(At(2, 7), 7));
    }

    [Fact]
    public void A_notification_waits_for_the_first_digest_time_after_it_was_made()
    {
        var madeBefore = At(2, 6, 59);
        var madeAfter = At(2, 7, 1);

        Assert.False(DigestSchedule.IsDue(madeBefore, At(2, 6, 59, 30), 7));
        Assert.True(DigestSchedule.IsDue(madeBefore, At(2, 7), 7));
        Assert.False(DigestSchedule.IsDue(madeAfter, At(2, 23), 7)); // today's digest has gone: tomorrow's
        Assert.True(DigestSchedule.IsDue(madeAfter, At(3, 7), 7));
    }

    [Fact]
    public void An_hour_outside_the_day_is_refused() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => DigestSchedule.LatestAtOrBefore(At(2, 7), 24));

    private static DateTimeOffset At(int day, int hour, int minute, int second) => new(2027, 3, day, hour, minute, second, TimeSpan.Zero);
}
