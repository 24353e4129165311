using EventReview.Core.Notifications;

namespace EventReview.Core.Tests.Notifications;

public sealed class DueRuleTests
{
    private static readonly DateOnly Today = new(2027, 3, 1);

    [Theory]
    [InlineData(2, DueStatus.NotYet)]
    [InlineData(1, DueStatus.Tomorrow)]
    [InlineData(0, DueStatus.Today)]
    [InlineData(-1, DueStatus.Overdue)]
    [InlineData(-30, DueStatus.Overdue)]
    public void A_due_date_is_classified_by_whole_utc_days(int daysAhead, DueStatus expected) =>
        Assert.Equal(expected, DueRule.Classify(Today.AddDays(daysAhead), Today));

    [Fact]
    public void No_due_date_is_never_due() => Assert.Equal(DueStatus.NotYet, DueRule.Classify(null, Today));

    [Fact]
    public void The_day_is_the_utc_day_even_late_in_the_evening_elsewhere()
    {
        // 23:30 on 28 February at UTC-05:00 is already 1 March in UTC: an item due 2 March is "tomorrow".
        var evening = new DateTimeOffset(2027, 2, 28, 23, 30, 0, TimeSpan.FromHours(-5));

        Assert.Equal(Today, DueRule.UtcDay(evening));
        Assert.Equal(DueStatus.Tomorrow, DueRule.Classify(new DateOnly(2027, 3, 2), DueRule.UtcDay(evening)));
    }
}
