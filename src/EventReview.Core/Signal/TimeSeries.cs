using EventReview.Core.Time;

namespace EventReview.Core.Signal;

/// <summary>
/// A uniformly sampled real time series: sample i is taken at Start + i / SampleRateHz (GPS time).
/// The samples array is shared, not copied: treat it as read-only once the series is built.
/// </summary>
public sealed class TimeSeries
{
    /// <summary>Creates a time series.</summary>
    /// <param name="start">GPS time of sample 0.</param>
    /// <param name="sampleRateHz">Samples per second (> 0, finite).</param>
    /// <param name="samples">The samples (strain, dimensionless, or any unit the caller states); at least one.</param>
    /// <exception cref="ArgumentOutOfRangeException">When the sample rate is not a positive finite number.</exception>
    /// <exception cref="ArgumentException">When there are no samples.</exception>
    public TimeSeries(GpsTime start, double sampleRateHz, double[] samples)
    {
        ArgumentNullException.ThrowIfNull(samples);
        if (!(sampleRateHz > 0) || !double.IsFinite(sampleRateHz))
        {
            throw new ArgumentOutOfRangeException(nameof(sampleRateHz), sampleRateHz, "Sample rate must be a positive finite number of Hz.");
        }

        if (samples.Length == 0)
        {
            throw new ArgumentException("A time series needs at least one sample.", nameof(samples));
        }

        Start = start;
        SampleRateHz = sampleRateHz;
        Samples = samples;
    }

    /// <summary>GPS time of the first sample.</summary>
    public GpsTime Start { get; }

    /// <summary>Sample rate in Hz.</summary>
    public double SampleRateHz { get; }

    /// <summary>The samples (shared array; do not modify).</summary>
    public double[] Samples { get; }

    /// <summary>Number of samples.</summary>
    public int Length => Samples.Length;

    /// <summary>Sample spacing in seconds (1 / SampleRateHz).</summary>
    public double StepSeconds => 1.0 / SampleRateHz;

    /// <summary>Length × step in seconds (the span covered, including the last sample's interval).</summary>
    public double DurationSeconds => Length / SampleRateHz;

    /// <summary>GPS time just after the last sample's interval: Start + Length / SampleRateHz.</summary>
    public GpsTime End => Start.AddSeconds(DurationSeconds);

    /// <summary>GPS time of sample <paramref name="index"/> (Start + index / SampleRateHz, rounded to the nanosecond).</summary>
    public GpsTime TimeOf(int index) => Start.AddSeconds(index / SampleRateHz);

    /// <summary>Seconds from Start to sample <paramref name="index"/>.</summary>
    public double SecondsOf(int index) => index / SampleRateHz;

    /// <summary>Index of the sample nearest to <paramref name="time"/> (may be outside 0..Length−1).</summary>
    public long NearestIndex(GpsTime time) => (long)Math.Round(time.SecondsSince(Start) * SampleRateHz);

    /// <summary>
    /// Samples whose times t satisfy from ≤ t &lt; to, as a new series (copied). The window is clipped to the data.
    /// </summary>
    /// <exception cref="ArgumentException">When the window holds no sample.</exception>
    public TimeSeries Slice(GpsTime from, GpsTime to)
    {
        long i0 = (long)Math.Ceiling((from.SecondsSince(Start) * SampleRateHz) - 1e-9);
        long i1 = (long)Math.Ceiling((to.SecondsSince(Start) * SampleRateHz) - 1e-9);
        i0 = Math.Clamp(i0, 0, Length);
        i1 = Math.Clamp(i1, 0, Length);
        if (i1 <= i0)
        {
            throw new ArgumentException($"The window {from} to {to} holds no sample of the series ({Start} to {End}).", nameof(from));
        }

        return Slice((int)i0, (int)(i1 - i0));
    }

    /// <summary>A copy of <paramref name="count"/> samples starting at <paramref name="startIndex"/>.</summary>
    public TimeSeries Slice(int startIndex, int count)
    {
        if (startIndex < 0 || count < 1 || startIndex + count > Length)
        {
            throw new ArgumentOutOfRangeException(nameof(startIndex), startIndex, "Slice must lie inside the series and hold at least one sample.");
        }

        return new TimeSeries(TimeOf(startIndex), SampleRateHz, Samples.AsSpan(startIndex, count).ToArray());
    }

    /// <summary>The same timing with other samples (same length required).</summary>
    public TimeSeries WithSamples(double[] samples)
    {
        ArgumentNullException.ThrowIfNull(samples);
        if (samples.Length != Length)
        {
            throw new ArgumentException("Replacement samples must have the same length.", nameof(samples));
        }

        return new TimeSeries(Start, SampleRateHz, samples);
    }
}
