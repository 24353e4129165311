using System.Globalization;

namespace EventReview.Core.Time;

/// <summary>
/// The leap-second expiry warnings, worded once for every output that converted a time with the table (app results and the
/// CLI's <c>--json</c> alike).
/// </summary>
public static class LeapSecondWarnings
{
    /// <summary>
    /// Warnings for a conversion of <paramref name="convertedUtc"/> (null when the output converted nothing itself) made on
    /// <paramref name="utcNow"/> (null to leave out the "table expired" warning, for stored results that must not depend on the clock):
    /// one when the instant lies on or after the table's expiry, one when the table has expired by now. Empty when neither holds.
    /// </summary>
    public static IReadOnlyList<string> For(LeapSecondTable table, DateTime? convertedUtc, DateTime? utcNow)
    {
        ArgumentNullException.ThrowIfNull(table);
        var ci = CultureInfo.InvariantCulture;
        var warnings = new List<string>();
        if (convertedUtc is { } at && !table.Covers(at))
        {
            warnings.Add(string.Create(ci,
                $"the instant {at:yyyy-MM-dd'T'HH:mm:ss'Z'} is on or after the leap-second table's expiry ({table.ExpiresUtc:yyyy-MM-dd}); UTC, GMST and RA may be off by a leap second"));
        }

        if (utcNow is { } now && table.IsStale(now))
        {
            warnings.Add(string.Create(ci,
                $"the leap-second table expired on {table.ExpiresUtc:yyyy-MM-dd}; a leap second announced since may be missing (update src/EventReview.Core/Time/leap-seconds.txt)"));
        }

        return warnings;
    }
}
