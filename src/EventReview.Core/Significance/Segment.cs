using EventReview.Core.Time;

namespace EventReview.Core.Significance;

/// <summary>
/// A stretch of analysed time, half-open [Start, End): an instant equal to End is outside.
/// </summary>
/// <param name="Start">First analysed instant (GPS, ns).</param>
/// <param name="End">First instant after the segment (GPS, ns); later than Start.</param>
public readonly record struct Segment(GpsTime Start, GpsTime End)
{
    /// <summary>Length in whole nanoseconds (End - Start).</summary>
    public long DurationNanoseconds => End.Nanoseconds - Start.Nanoseconds;

    /// <summary>Length in seconds.</summary>
    public double DurationSeconds => DurationNanoseconds / (double)GpsTime.NanosecondsPerSecond;

    /// <summary>True when Start &lt;= time &lt; End.</summary>
    public bool Contains(GpsTime time) => time >= Start && time < End;
}
