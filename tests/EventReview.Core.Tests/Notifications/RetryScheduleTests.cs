using EventReview.Core.Notifications;

namespace EventReview.Core.Tests.Notifications;

public sealed class RetryScheduleTests
{
    [Fact]
    public void The_wait_doubles_from_thirty_seconds_up_to_an_hour()
    {
        // Exponential back-off with a cap (common practice): 30 s, 1, 2, 4, 8, 16, 32 min, then 1 h.
        var waits = Enumerable.Range(1, 9).Select(n => RetrySchedule.DelayAfter(n).TotalSeconds).ToArray();

        Assert.Equal([30, 60, 120, 240, 480, 960, 1920, 3600, 3600], waits);
        Assert.Equal(TimeSpan.FromHours(1), RetrySchedule.DelayAfter(10_000));
    }

    [Fact]
    public void Retries_stop_once_the_message_is_older_than_the_give_up_time()
    {
        var created = new DateTimeOffset(2027, 3, 1, 0, 0, 0, TimeSpan.Zero);
        var giveUp = TimeSpan.FromHours(72);

        Assert.Equal(created.AddSeconds(30), RetrySchedule.NextAttempt(created, created, 1, giveUp));
        Assert.Equal(created.AddHours(71.5), RetrySchedule.NextAttempt(created, created.AddHours(70.5), 40, giveUp));
        Assert.Null(RetrySchedule.NextAttempt(created, created.AddHours(71.5), 41, giveUp));
    }

    [Fact]
    public void Fewer_than_one_failed_attempt_is_refused() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => RetrySchedule.DelayAfter(0));
}
