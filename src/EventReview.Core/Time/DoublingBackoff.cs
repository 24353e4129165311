namespace EventReview.Core.Time;

/// <summary>
/// Exponential back-off with a cap (common practice): <c>first</c> after one failure, then doubling after each further
/// failure in a row, never longer than <c>longest</c>. Shared by the notification retries and the live channel's
/// reconnects, which differ only in their two durations.
/// </summary>
public static class DoublingBackoff
{
    /// <summary>Wait after <paramref name="failures"/> failures in a row (1 or more).</summary>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="failures"/> is below 1.</exception>
    public static TimeSpan After(TimeSpan first, TimeSpan longest, int failures)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(failures, 1);
        var ms = first.TotalMilliseconds * Math.Pow(2, Math.Min(failures - 1, 20));
        return ms >= longest.TotalMilliseconds ? longest : TimeSpan.FromMilliseconds(ms);
    }
}
