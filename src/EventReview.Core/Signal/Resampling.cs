using EventReview.Core.Signal.Filters;

namespace EventReview.Core.Signal;

/// <summary>Bringing two series to a common sample rate.</summary>
public static class Resampling
{
    /// <summary>
    /// Decimates by an integer factor: zero-phase 8th-order Butterworth low-pass at 0.8 × the new Nyquist frequency
    /// (forward-backward), then every factor-th sample from the first. The start time is kept.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">When the factor is below 1 or leaves fewer than 16 samples.</exception>
    public static TimeSeries Decimate(TimeSeries series, int factor)
    {
        ArgumentNullException.ThrowIfNull(series);
        if (factor < 1 || series.Length / factor < 16)
        {
            throw new ArgumentOutOfRangeException(nameof(factor), factor, "Decimation factor must be at least 1 and leave at least 16 samples.");
        }

        if (factor == 1)
        {
            return series;
        }

        double newRate = series.SampleRateHz / factor;
        var sos = SecondOrderSections.FromZpk(Butterworth.LowPass(8, 0.4 * newRate, series.SampleRateHz));
        var filtered = FiltFilt.Apply(sos, series.Samples);
        var outp = new double[(series.Length + factor - 1) / factor];
        for (int i = 0; i < outp.Length; i++)
        {
            outp[i] = filtered[i * factor];
        }

        return new TimeSeries(series.Start, newRate, outp);
    }

    /// <summary>
    /// Returns the two series at a common rate. Equal rates (within 1e-9 relative) are returned unchanged; when one rate is an
    /// integer multiple of the other the faster series is decimated; otherwise the call is refused.
    /// </summary>
    /// <returns>The two series and a plain note saying what was done.</returns>
    /// <exception cref="ArgumentException">When the rates are not in an integer ratio.</exception>
    public static (TimeSeries A, TimeSeries B, string Note) ToCommonRate(TimeSeries a, TimeSeries b)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        double ra = a.SampleRateHz, rb = b.SampleRateHz;
        if (Math.Abs(ra - rb) <= 1e-9 * ra)
        {
            return (a, b, $"both series sampled at {ra:G} Hz; no resampling");
        }

        bool aFaster = ra > rb;
        double ratio = aFaster ? ra / rb : rb / ra;
        int factor = (int)Math.Round(ratio);
        if (Math.Abs(ratio - factor) > 1e-9 * ratio)
        {
            throw new ArgumentException($"Sample rates {ra:G} Hz and {rb:G} Hz are not in an integer ratio; resample one file to the other's rate before comparing.", nameof(b));
        }

        return aFaster
            ? (Decimate(a, factor), b, $"series A decimated by {factor} from {ra:G} Hz to {rb:G} Hz (8th-order zero-phase low-pass at {0.4 * rb:G} Hz)")
            : (a, Decimate(b, factor), $"series B decimated by {factor} from {rb:G} Hz to {ra:G} Hz (8th-order zero-phase low-pass at {0.4 * ra:G} Hz)");
    }
}
