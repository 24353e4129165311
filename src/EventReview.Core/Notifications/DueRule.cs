namespace EventReview.Core.Notifications;

/// <summary>
/// Due dates are calendar dates in UTC (the item panel shows them as <c>yyyy-MM-dd</c>). An item is due "tomorrow"
/// on the UTC day before its date, "today" on its date, and overdue from the UTC day after it. Only unsigned items of
/// open cases with an owner are ever due (the caller filters those).
/// </summary>
public static class DueRule
{
    /// <summary>The status of an item due on <paramref name="due"/>, seen on the UTC day <paramref name="today"/>.</summary>
    public static DueStatus Classify(DateOnly? due, DateOnly today)
    {
        if (due is not { } d)
        {
            return DueStatus.NotYet;
        }

        var days = d.DayNumber - today.DayNumber;
        return days switch
        {
            < 0 => DueStatus.Overdue,
            0 => DueStatus.Today,
            1 => DueStatus.Tomorrow,
            _ => DueStatus.NotYet,
        };
    }

    /// <summary>The UTC calendar day of <paramref name="now"/>.</summary>
    public static DateOnly UtcDay(DateTimeOffset now) => DateOnly.FromDateTime(now.UtcDateTime);

    /// <summary>
    /// Latest due date that needs a notice on <paramref name="today"/> (tomorrow's date): items due after it can be
    /// left out of the query.
    /// </summary>
    public static DateOnly NoticeHorizon(DateOnly today) => today.AddDays(1);
}
