namespace EventReview.Core.Time;

/// <summary>
/// The state of the leap-second table behind a GPS-to-UTC conversion, to print beside any result that shows a UTC time:
/// when the table expires, whether it has expired by now, whether the converted instant lies beyond its expiry, and a
/// warning sentence when either is true (conversions after the expiry may miss a leap second).
/// </summary>
/// <param name="Utc">The converted instant, ISO 8601 with milliseconds ("…T23:59:60.000Z" during a leap second).</param>
/// <param name="TableExpires">Expiry date of the table, yyyy-MM-dd.</param>
/// <param name="TableStale">True when today is on or after the expiry date.</param>
/// <param name="BeyondTableExpiry">True when the converted instant is on or after the expiry date.</param>
/// <param name="Warning">The warning to show, or null when the conversion is covered and the table is current.</param>
public sealed record LeapSecondNotice(string Utc, string TableExpires, bool TableStale, bool BeyondTableExpiry, string? Warning)
{
    /// <summary>Converts <paramref name="gps"/> to UTC with the table and states the table's condition at <paramref name="utcNow"/>.</summary>
    /// <param name="gps">The instant converted.</param>
    /// <param name="utcNow">Now, from the caller's clock (<see cref="TimeProvider"/>).</param>
    /// <param name="table">The table; null for the bundled one.</param>
    public static LeapSecondNotice For(GpsTime gps, DateTime utcNow, LeapSecondTable? table = null)
    {
        table ??= LeapSecondTable.Bundled;
        var utc = GpsUtc.ToUtc(gps, table);
        var stale = table.IsStale(utcNow);
        var beyond = !table.Covers(utc.DateTimeUtc);
        var expires = table.ExpiresUtc.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture);
        string? warning = beyond
            ? $"the instant lies on or after the leap-second table's expiry ({expires}): its UTC may be off by a leap second; update src/EventReview.Core/Time/leap-seconds.txt"
            : stale
                ? $"the leap-second table expired on {expires}: conversions of later instants may miss a leap second; update src/EventReview.Core/Time/leap-seconds.txt"
                : null;
        return new LeapSecondNotice(utc.ToString(3), expires, stale, beyond, warning);
    }
}
