namespace EventReview.Core.Cases;

/// <summary>Times written into the record are UTC with whole-microsecond resolution, so every supported database stores them exactly.</summary>
public static class RecordClock
{
    /// <summary>The instant in UTC, truncated to the microsecond.</summary>
    public static DateTimeOffset Normalize(DateTimeOffset t)
    {
        var utc = t.UtcTicks;
        return new DateTimeOffset(utc - (utc % 10), TimeSpan.Zero);
    }
}
