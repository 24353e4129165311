namespace EventReview.Core.Time;

/// <summary>
/// Greenwich mean sidereal time from UT1 by the IAU 1982 expression (Meeus, "Astronomical Algorithms",
/// 2nd ed., eq. 12.4). Callers that only have UTC pass it for UT1: |UT1 - UTC| &lt; 0.9 s costs &lt; 0.004°.
/// </summary>
public static class Sidereal
{
    private static readonly DateTime J2000 = new(2000, 1, 1, 12, 0, 0, DateTimeKind.Utc);

    /// <summary>
    /// GMST in degrees, in [0, 360), for a UT1 instant given as a <see cref="DateTime"/> (UTC may be passed as an
    /// approximation of UT1). The days since J2000.0 are split into whole days and a fraction, so that the
    /// 360°/day term keeps full precision (a single double Julian date would lose ~1e-7°).
    /// </summary>
    public static double GreenwichMeanSiderealDegrees(DateTime ut1)
    {
        var ticks = ut1.Ticks - J2000.Ticks;
        var wholeDays = Math.DivRem(ticks, TimeSpan.TicksPerDay, out var remainder);
        if (remainder < 0)
        {
            wholeDays -= 1;
            remainder += TimeSpan.TicksPerDay;
        }

        return GreenwichMeanSiderealDegrees(wholeDays, remainder / (double)TimeSpan.TicksPerDay);
    }

    /// <summary>GMST in degrees, [0, 360), for a UTC instant, a leap second counted as the last second of its day continued.</summary>
    public static double GreenwichMeanSiderealDegrees(UtcInstant utc) =>
        GreenwichMeanSiderealDegrees(utc.IsLeapSecond ? utc.DateTimeUtc.AddSeconds(1) : utc.DateTimeUtc);

    /// <summary>
    /// GMST in degrees, [0, 360), from days since J2000.0 (JD 2451545.0, UT1) split into a whole part and a
    /// fraction in [0, 1).
    /// </summary>
    public static double GreenwichMeanSiderealDegrees(long wholeDaysSinceJ2000, double dayFraction)
    {
        var days = wholeDaysSinceJ2000 + dayFraction;
        var t = days / 36525.0;

        // Meeus eq. 12.4: 280.46061837 + 360.98564736629 (JD - 2451545) + 0.000387933 T² - T³/38710000;
        // 360 × whole days is a multiple of 360 and is left out.
        var gmst = 280.46061837
            + (360.0 * dayFraction)
            + (0.98564736629 * wholeDaysSinceJ2000)
            + (0.98564736629 * dayFraction)
            + (0.000387933 * t * t)
            - (t * t * t / 38_710_000.0);
        gmst %= 360.0;
        return gmst < 0 ? gmst + 360.0 : gmst;
    }
}
