namespace EventReview.Core.Notifications;

/// <summary>
/// When a daily digest goes out: once a day at a fixed hour (UTC). A person's waiting notifications are sent together
/// at the first digest time after the oldest of them was made; the schedule needs no memory of earlier digests.
/// </summary>
public static class DigestSchedule
{
    /// <summary>The most recent digest time at or before <paramref name="now"/>, for digests at <paramref name="hourUtc"/>:00 UTC.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="hourUtc"/> is not 0 to 23.</exception>
    public static DateTimeOffset LatestAtOrBefore(DateTimeOffset now, int hourUtc)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(hourUtc);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(hourUtc, 23);
        var utc = now.ToUniversalTime();
        var today = new DateTimeOffset(utc.Year, utc.Month, utc.Day, hourUtc, 0, 0, TimeSpan.Zero);
        return today <= utc ? today : today.AddDays(-1);
    }

    /// <summary>
    /// True when a digest is due: the oldest waiting notification was made before the latest digest time. A
    /// notification made after that time waits for the next day's digest.
    /// </summary>
    public static bool IsDue(DateTimeOffset oldestWaiting, DateTimeOffset now, int hourUtc) => oldestWaiting < LatestAtOrBefore(now, hourUtc);

    /// <summary>The next digest time strictly after <paramref name="now"/> (for "next digest at ..." on the profile page).</summary>
    public static DateTimeOffset Next(DateTimeOffset now, int hourUtc) => LatestAtOrBefore(now, hourUtc).AddDays(1);
}
