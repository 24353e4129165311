namespace EventReview.Core.Time;

/// <summary>
/// One row of the leap-second table: from 00:00:00 UTC of <see cref="StartsUtc"/> on, TAI - UTC and
/// GPS - UTC are the given whole seconds (TAI - GPS = 19 s always).
/// </summary>
public sealed record LeapSecondEntry(DateOnly StartsUtc, int TaiMinusUtcSeconds, int GpsMinusUtcSeconds)
{
    /// <summary>GPS whole second at which this offset starts (the GPS second of 00:00:00 UTC of <see cref="StartsUtc"/>).</summary>
    public long StartsGpsSeconds =>
        ((long)(StartsUtc.ToDateTime(TimeOnly.MinValue, DateTimeKind.Utc) - GpsUtc.EpochUtc).TotalSeconds) + GpsMinusUtcSeconds;
}
