using EventReview.Core.Time;

namespace EventReview.Core.Injections;

/// <summary>One row of an injection log or of an opened blind-injection record.</summary>
/// <param name="Site">Upper-case site code.</param>
/// <param name="Start">First instant of the injected waveform.</param>
/// <param name="End">Last instant of the injected waveform (End &gt;= Start; equal for an instantaneous marker).</param>
/// <param name="Kind">Injection kind as written (e.g. "burst", "cbc", "stochastic").</param>
/// <param name="WaveformRef">Reference to the waveform file or description.</param>
/// <param name="Status">Scheduled, performed or aborted.</param>
public sealed record InjectionRecord(string Site, GpsTime Start, GpsTime End, string Kind, string WaveformRef, InjectionStatus Status)
{
    /// <summary>Duration End - Start in seconds.</summary>
    public double DurationSeconds => End.SecondsSince(Start);
}
