namespace EventReview.Core.Time;

/// <summary>
/// The precision of times that enter a hash (timeline entries, evidence, computation records): whole milliseconds,
/// UTC. Every supported store keeps that exactly (SQLite stores exact UTC ticks through the data layer's
/// <c>UtcTicksConverter</c>; PostgreSQL's <c>timestamp with time zone</c> keeps 1 µs), so a hash computed before saving
/// still verifies after loading. A raw clock reading with 100 ns ticks would lose its last digit on PostgreSQL.
/// </summary>
public static class RecordedTime
{
    /// <summary>
    /// <paramref name="time"/> in UTC (offset zero), truncated toward the past to a whole millisecond.
    /// </summary>
    public static DateTimeOffset Normalize(DateTimeOffset time)
    {
        var ticks = time.UtcTicks;
        return new DateTimeOffset(ticks - (ticks % TimeSpan.TicksPerMillisecond), TimeSpan.Zero);
    }
}
