using System.Globalization;
using System.Text.RegularExpressions;

namespace EventReview.Core.Time;

/// <summary>
/// A UTC instant that can also be a leap second (23:59:60.xxx), which <see cref="DateTime"/> cannot hold.
/// <see cref="DateTimeUtc"/> is the instant itself except during a leap second, where it holds 23:59:59 of the
/// same day plus the fraction of the leap second and <see cref="IsLeapSecond"/> is true. Resolution 100 ns.
/// </summary>
public readonly partial record struct UtcInstant(DateTime DateTimeUtc, bool IsLeapSecond)
{
    /// <summary>ISO 8601 with milliseconds and a 'Z' ("2016-12-31T23:59:60.000Z" for the leap second).</summary>
    public override string ToString() => ToString(3);

    /// <summary>ISO 8601 with 0-7 fractional second digits (truncated, not rounded, so 23:59:59.9999 never becomes 24:00).</summary>
    public string ToString(int decimals)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(decimals);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(decimals, 7);
        var t = DateTimeUtc;
        var seconds = IsLeapSecond ? 60 : t.Second;
        var text = string.Create(CultureInfo.InvariantCulture, $"{t:yyyy-MM-dd'T'HH:mm}:{seconds:D2}");
        if (decimals > 0)
        {
            var ticks = t.Ticks % TimeSpan.TicksPerSecond;
            var fraction = ticks.ToString("D7", CultureInfo.InvariantCulture)[..decimals];
            text += "." + fraction;
        }

        return text + "Z";
    }

    /// <summary>
    /// Parses an ISO 8601 UTC date-time ("2017-01-01T00:00:00Z", "2016-12-31T23:59:60.5Z"; a missing zone is
    /// read as UTC, an explicit offset is converted to UTC). Seconds = 60 is accepted only at 23:59 and marks a
    /// leap second (whether one really occurred is checked by <see cref="GpsUtc.FromUtc(UtcInstant, LeapSecondTable?)"/>).
    /// </summary>
    public static bool TryParse(string? text, out UtcInstant value)
    {
        value = default;
        if (string.IsNullOrWhiteSpace(text))
        {
            return false;
        }

        text = text.Trim();
        var leap = false;
        var match = LeapPattern().Match(text);
        if (match.Success)
        {
            leap = true;
            text = match.Groups["head"].Value + "59" + match.Groups["tail"].Value;
        }

        if (!DateTime.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.AdjustToUniversal | DateTimeStyles.AssumeUniversal, out var parsed))
        {
            return false;
        }

        if (leap && !(parsed.Hour == 23 && parsed.Minute == 59))
        {
            return false;
        }

        value = new UtcInstant(DateTime.SpecifyKind(parsed, DateTimeKind.Utc), leap);
        return true;
    }

    [GeneratedRegex(@"^(?<head>\d{4}-\d{2}-\d{2}[T ]23:59:)60(?<tail>(\.\d+)?(Z|[+-]00:?00)?)$")]
    private static partial Regex LeapPattern();
}
