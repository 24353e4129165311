using EventReview.Core.Signal.Filters;
using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Signal;

/// <summary>Welch PSD, whitening, zero-phase Butterworth band-pass and notches, in that order.</summary>
public static class Conditioning
{
    /// <summary>
    /// Conditions <paramref name="series"/>: PSD by Welch (periodic Hann, 50 % overlap, segment = PsdSegmentSeconds, or the
    /// largest power of two that fits; segments combined as <see cref="ConditioningOptions.PsdAverage"/> says), whitening with a Tukey taper, then forward-backward Butterworth band-pass and
    /// notches. Samples within TaperSeconds + SettleSeconds of either end are marked as not valid.
    /// </summary>
    /// <exception cref="ArgumentException">When the band is not inside (0, Nyquist) or the series is too short to leave a valid range.</exception>
    public static ConditionedSeries Condition(TimeSeries series, ConditioningOptions options)
    {
        ArgumentNullException.ThrowIfNull(series);
        ArgumentNullException.ThrowIfNull(options);
        double fs = series.SampleRateHz;
        if (!(options.LowHz > 0) || !(options.HighHz > options.LowHz) || !(options.HighHz < fs / 2))
        {
            throw new ArgumentException($"Band {options.LowHz}-{options.HighHz} Hz must satisfy 0 < low < high < Nyquist ({fs / 2} Hz).", nameof(options));
        }

        var psd = EstimatePsd(series, options);
        int taper = (int)Math.Round(options.TaperSeconds * fs);
        var white = Whitening.Whiten(series.Samples, fs, psd, taper);
        var filtered = FiltFilt.Apply(Sections(options, fs), white);
        int margin = taper + (int)Math.Round(options.SettleSeconds * fs);
        if (2 * margin >= series.Length)
        {
            throw new ArgumentException($"The series ({series.DurationSeconds:F3} s) is too short for the taper and settling margins.", nameof(series));
        }

        return new ConditionedSeries(series.WithSamples(filtered), psd, margin, series.Length - margin);
    }

    /// <summary>
    /// The Welch PSD that <see cref="Condition"/> whitens with (periodic Hann, 50 % overlap, segment = PsdSegmentSeconds or the
    /// largest power of two that fits, segments combined as <see cref="ConditioningOptions.PsdAverage"/> says), in strain²/Hz.
    /// </summary>
    public static Psd EstimatePsd(TimeSeries series, ConditioningOptions options)
    {
        ArgumentNullException.ThrowIfNull(series);
        ArgumentNullException.ThrowIfNull(options);
        int seg = (int)Math.Round(options.PsdSegmentSeconds * series.SampleRateHz);
        if (seg > series.Length)
        {
            seg = RealFft.NextPowerOfTwo(series.Length + 1) / 2;
        }

        return Welch.Estimate(series.Samples, series.SampleRateHz, new WelchOptions(seg, Average: options.PsdAverage));
    }

    /// <summary>Second-order sections of the band-pass followed by the notches, for sample rate fs (Hz).</summary>
    public static SosSection[] Sections(ConditioningOptions options, double sampleRateHz)
    {
        ArgumentNullException.ThrowIfNull(options);
        var sos = new List<SosSection>(SecondOrderSections.FromZpk(Butterworth.BandPass(options.FilterOrder, options.LowHz, options.HighHz, sampleRateHz)));
        foreach (var f in options.NotchFrequenciesHz ?? [])
        {
            sos.AddRange(SecondOrderSections.FromZpk(Notch.Design(f, options.NotchQuality, sampleRateHz)));
        }

        return sos.ToArray();
    }
}
