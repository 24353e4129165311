namespace EventReview.Core.Time;

/// <summary>
/// GPS &lt;-&gt; UTC conversion with a leap-second table (GPS = UTC + leap seconds since 1980, e.g. 18 s from
/// 2017-01-01). Instants before the GPS epoch use the first row (offset 0). Instants after the table's expiry
/// use its last row: check <see cref="LeapSecondTable.Covers"/> and show a warning when false.
/// </summary>
public static class GpsUtc
{
    /// <summary>The GPS epoch, 1980-01-06T00:00:00 UTC.</summary>
    public static readonly DateTime EpochUtc = new(1980, 1, 6, 0, 0, 0, DateTimeKind.Utc);

    /// <summary>UTC of a GPS instant (truncated to 100 ns). During a leap second the result has <see cref="UtcInstant.IsLeapSecond"/> set.</summary>
    public static UtcInstant ToUtc(GpsTime gps, LeapSecondTable? table = null)
    {
        table ??= LeapSecondTable.Bundled;
        var whole = gps.WholeSeconds;
        var fractionNanoseconds = gps.Nanoseconds - (whole * GpsTime.NanosecondsPerSecond);
        var fractionTicks = fractionNanoseconds / 100;
        var index = table.IndexAtGpsSecond(whole);
        var entries = table.Entries;
        if (index + 1 < entries.Count)
        {
            var next = entries[index + 1];
            var step = next.GpsMinusUtcSeconds - entries[index].GpsMinusUtcSeconds;
            if (step > 0 && whole >= next.StartsGpsSeconds - step)
            {
                // Inside an inserted leap second: show 23:59:60 of the day before the new offset starts.
                var lastSecond = next.StartsUtc.ToDateTime(TimeOnly.MinValue, DateTimeKind.Utc).AddSeconds(-1);
                return new UtcInstant(lastSecond.AddTicks(fractionTicks), true);
            }
        }

        var utc = EpochUtc.AddSeconds(whole - entries[index].GpsMinusUtcSeconds).AddTicks(fractionTicks);
        return new UtcInstant(utc, false);
    }

    /// <summary>GPS time of a UTC date-time (its Kind must be Utc or Unspecified, read as UTC).</summary>
    /// <exception cref="ArgumentException">When <paramref name="utc"/> has Kind Local.</exception>
    public static GpsTime FromUtc(DateTime utc, LeapSecondTable? table = null)
    {
        if (utc.Kind == DateTimeKind.Local)
        {
            throw new ArgumentException("The date-time must be UTC, not local time.", nameof(utc));
        }

        table ??= LeapSecondTable.Bundled;
        var entry = table.EntryAtUtc(utc);
        var ticks = (utc.Ticks - EpochUtc.Ticks) + (entry.GpsMinusUtcSeconds * TimeSpan.TicksPerSecond);
        return new GpsTime(ticks * 100);
    }

    /// <summary>GPS time of a UTC instant, including a leap second (23:59:60.x maps to the GPS second before the new offset).</summary>
    /// <exception cref="ArgumentException">When the instant is marked as a leap second but the table has none at the end of that day.</exception>
    public static GpsTime FromUtc(UtcInstant utc, LeapSecondTable? table = null)
    {
        if (!utc.IsLeapSecond)
        {
            return FromUtc(utc.DateTimeUtc, table);
        }

        table ??= LeapSecondTable.Bundled;
        var nextDay = DateOnly.FromDateTime(utc.DateTimeUtc).AddDays(1);
        var entries = table.Entries;
        for (var i = 1; i < entries.Count; i++)
        {
            if (entries[i].StartsUtc == nextDay && entries[i].GpsMinusUtcSeconds > entries[i - 1].GpsMinusUtcSeconds)
            {
                return FromUtc(utc.DateTimeUtc, table).AddSeconds(1);
            }
        }

        throw new ArgumentException($"No leap second at the end of {utc.DateTimeUtc:yyyy-MM-dd} in the leap-second table.", nameof(utc));
    }
}
