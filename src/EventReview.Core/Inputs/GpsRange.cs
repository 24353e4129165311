using EventReview.Core.Time;

namespace EventReview.Core.Inputs;

/// <summary>
/// GPS times the app accepts for a candidate or an arrival: after the GPS epoch (1980-01-06T00:00:00 UTC) and before the
/// bundled leap-second table's expiry plus 10 years. Beyond the expiry a conversion to UTC may miss leap seconds (the
/// pages say so); ten years past it a time is certainly a typing or unit error, not a candidate.
/// </summary>
public static class GpsRange
{
    /// <summary>Years after the leap-second table's expiry still accepted.</summary>
    public const int YearsPastTable = 10;

    /// <summary>The latest accepted instant (exclusive): the table's expiry date plus <see cref="YearsPastTable"/> years, 00:00 UTC.</summary>
    public static GpsTime Latest { get; } = GpsUtc.FromUtc(
        LeapSecondTable.Bundled.ExpiresUtc.AddYears(YearsPastTable).ToDateTime(TimeOnly.MinValue, DateTimeKind.Utc));

    /// <summary>True when <paramref name="t"/> is after the GPS epoch and before <see cref="Latest"/>.</summary>
    public static bool Contains(GpsTime t) => t > GpsTime.Epoch && t < Latest;

    /// <summary>The range in words, for messages: "after 0 (1980-01-06) and before 1813968018 (2037-06-28)".</summary>
    public static string Describe() =>
        $"after GPS 0 (1980-01-06 UTC) and before GPS {Latest} ({LeapSecondTable.Bundled.ExpiresUtc.AddYears(YearsPastTable):yyyy-MM-dd} UTC, the leap-second table's expiry + {YearsPastTable} years)";
}
