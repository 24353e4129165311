using EventReview.Core.Time;

namespace EventReview.Core.Notifications;

/// <summary>
/// How a failed delivery (SMTP server or webhook unreachable, refused or slow) is retried: after 30 s, then doubling
/// (1, 2, 4, 8 ... min) up to one attempt an hour, until the configured give-up time after the message's creation has
/// passed. Exponential back-off with a cap is common practice for outbound delivery.
/// </summary>
public static class RetrySchedule
{
    /// <summary>Wait before the second attempt.</summary>
    public static readonly TimeSpan First = TimeSpan.FromSeconds(30);

    /// <summary>Longest wait between attempts.</summary>
    public static readonly TimeSpan Longest = TimeSpan.FromHours(1);

    /// <summary>Wait after the <paramref name="failedAttempts"/>-th failed attempt (1 or more).</summary>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="failedAttempts"/> is below 1.</exception>
    public static TimeSpan DelayAfter(int failedAttempts)
        => DoublingBackoff.After(First, Longest, failedAttempts);

    /// <summary>
    /// When to try again after a failure at <paramref name="failedAt"/>, or null when the message is older than
    /// <paramref name="giveUpAfter"/> (created at <paramref name="createdAt"/>) and should be marked as given up.
    /// </summary>
    public static DateTimeOffset? NextAttempt(DateTimeOffset createdAt, DateTimeOffset failedAt, int failedAttempts, TimeSpan giveUpAfter)
    {
        var next = failedAt + DelayAfter(failedAttempts);
        return next - createdAt > giveUpAfter ? null : next;
    }
}
