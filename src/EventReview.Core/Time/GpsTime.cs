using System.Globalization;

namespace EventReview.Core.Time;

/// <summary>
/// An instant on the GPS time scale: seconds since 1980-01-06T00:00:00 UTC, without leap seconds.
/// Stored as whole nanoseconds in a 64-bit integer so that sub-microsecond precision is kept for
/// any instant of the next few centuries (a double would keep only ~0.2 µs at today's GPS seconds).
/// </summary>
public readonly record struct GpsTime : IComparable<GpsTime>
{
    /// <summary>Nanoseconds in one second.</summary>
    public const long NanosecondsPerSecond = 1_000_000_000L;

    /// <summary>Creates a GPS time from whole nanoseconds since the GPS epoch.</summary>
    public GpsTime(long nanoseconds) => Nanoseconds = nanoseconds;

    /// <summary>Nanoseconds since the GPS epoch (may be negative for instants before it).</summary>
    public long Nanoseconds { get; }

    /// <summary>Seconds since the GPS epoch as a double (loses precision below ~0.2 µs at current epochs).</summary>
    public double Seconds => Nanoseconds / (double)NanosecondsPerSecond;

    /// <summary>Whole seconds since the GPS epoch (floor).</summary>
    public long WholeSeconds => Nanoseconds >= 0 ? Nanoseconds / NanosecondsPerSecond : -((-Nanoseconds + NanosecondsPerSecond - 1) / NanosecondsPerSecond);

    /// <summary>The GPS epoch, 1980-01-06T00:00:00 UTC.</summary>
    public static GpsTime Epoch => new(0);

    /// <summary>Creates a GPS time from seconds given as a double, rounded to the nearest nanosecond.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When the value is not finite or out of the representable range.</exception>
    public static GpsTime FromSeconds(double seconds)
    {
        if (!double.IsFinite(seconds) || Math.Abs(seconds) > 9.2e9)
        {
            throw new ArgumentOutOfRangeException(nameof(seconds), seconds, "GPS seconds must be a finite number within ±9.2e9 s.");
        }

        var whole = Math.Floor(seconds);
        var frac = seconds - whole;
        return new GpsTime(((long)whole * NanosecondsPerSecond) + (long)Math.Round(frac * NanosecondsPerSecond));
    }

    /// <summary>Creates a GPS time from exact decimal seconds (as parsed from JSON or text), rounded to the nearest nanosecond.</summary>
    public static GpsTime FromSeconds(decimal seconds)
    {
        if (Math.Abs(seconds) > 9.2e9m)
        {
            throw new ArgumentOutOfRangeException(nameof(seconds), seconds, "GPS seconds must be within ±9.2e9 s.");
        }

        return new GpsTime((long)Math.Round(seconds * NanosecondsPerSecond, MidpointRounding.ToEven));
    }

    /// <summary>Parses GPS seconds written in decimal ("1234567890.123456789"), keeping every digit to the nanosecond.</summary>
    public static bool TryParse(string? text, out GpsTime value)
    {
        value = default;
        if (string.IsNullOrWhiteSpace(text))
        {
            return false;
        }

        if (decimal.TryParse(text.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out var d) && Math.Abs(d) <= 9.2e9m)
        {
            value = FromSeconds(d);
            return true;
        }

        return false;
    }

    /// <summary>Seconds from <paramref name="other"/> to this instant (this - other), exact to the nanosecond before conversion.</summary>
    public double SecondsSince(GpsTime other) => (Nanoseconds - other.Nanoseconds) / (double)NanosecondsPerSecond;

    /// <summary>This instant shifted by a number of seconds.</summary>
    public GpsTime AddSeconds(double seconds) => new(Nanoseconds + (long)Math.Round(seconds * NanosecondsPerSecond));

    /// <inheritdoc />
    public int CompareTo(GpsTime other) => Nanoseconds.CompareTo(other.Nanoseconds);

    /// <summary>True when <paramref name="a"/> is earlier than <paramref name="b"/>.</summary>
    public static bool operator <(GpsTime a, GpsTime b) => a.Nanoseconds < b.Nanoseconds;
    /// <summary>True when <paramref name="a"/> is later than <paramref name="b"/>.</summary>
    public static bool operator >(GpsTime a, GpsTime b) => a.Nanoseconds > b.Nanoseconds;
    /// <summary>True when <paramref name="a"/> is not later than <paramref name="b"/>.</summary>
    public static bool operator <=(GpsTime a, GpsTime b) => a.Nanoseconds <= b.Nanoseconds;
    /// <summary>True when <paramref name="a"/> is not earlier than <paramref name="b"/>.</summary>
    public static bool operator >=(GpsTime a, GpsTime b) => a.Nanoseconds >= b.Nanoseconds;

    /// <summary>Decimal seconds with all nine fractional digits, trailing zeros removed ("1187008882.4").</summary>
    public override string ToString()
    {
        var sign = Nanoseconds < 0 ? "-" : string.Empty;
        var abs = Math.Abs(Nanoseconds);
        var whole = abs / NanosecondsPerSecond;
        var frac = abs % NanosecondsPerSecond;
        return frac == 0
            ? string.Create(CultureInfo.InvariantCulture, $"{sign}{whole}")
            : string.Create(CultureInfo.InvariantCulture, $"{sign}{whole}.{frac:D9}").TrimEnd('0');
    }

    /// <summary>Decimal seconds rounded to the given number of fractional digits.</summary>
    public string ToString(int decimals) => Seconds.ToString("F" + decimals, CultureInfo.InvariantCulture);
}
