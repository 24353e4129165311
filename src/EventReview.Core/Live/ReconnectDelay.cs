using EventReview.Core.Time;

namespace EventReview.Core.Live;

/// <summary>
/// How long the live channel's listener waits before it connects again after its connection dropped: 0.5 s, then
/// doubling (1, 2, 4 ... s) up to <see cref="Longest"/>. Exponential back-off with a cap is common practice; the short
/// start matters because news is missed while the listener is away (the pages reload once it is back).
/// </summary>
public static class ReconnectDelay
{
    /// <summary>Wait after the first failure.</summary>
    public static readonly TimeSpan First = TimeSpan.FromMilliseconds(500);

    /// <summary>Longest wait.</summary>
    public static readonly TimeSpan Longest = TimeSpan.FromSeconds(30);

    /// <summary>Wait after <paramref name="failures"/> failures in a row (1 or more).</summary>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="failures"/> is below 1.</exception>
    public static TimeSpan After(int failures)
        => DoublingBackoff.After(First, Longest, failures);
}
