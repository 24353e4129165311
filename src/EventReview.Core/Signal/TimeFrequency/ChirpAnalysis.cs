using EventReview.Core.Time;

namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Conditioning, multi-resolution Q map and chirp fit of one site around a candidate, in one call.</summary>
public static class ChirpAnalysis
{
    /// <summary>
    /// Whitens and band-passes <paramref name="strain"/> (band from the Q options, default 20-500 Hz, capped below Nyquist; median-
    /// averaged PSD), maps [center − beforeSeconds, center + afterSeconds] with the Q transform and fits the chirp track. Times in the
    /// result are relative to the centre.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">When the span before and after is negative or empty.</exception>
    /// <exception cref="ArgumentException">When the data are too short for the span or the band is invalid.</exception>
    public static ChirpAnalysisResult Run(TimeSeries strain, GpsTime center, double beforeSeconds = 2, double afterSeconds = 0.2,
        QTransformOptions? map = null, ChirpTrackOptions? track = null, ConditioningOptions? conditioning = null)
    {
        ArgumentNullException.ThrowIfNull(strain);
        map ??= new QTransformOptions();
        if (!(beforeSeconds >= 0) || !(afterSeconds >= 0) || beforeSeconds + afterSeconds <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(beforeSeconds), beforeSeconds, "The span before and after the centre must be non-negative and not both zero (s).");
        }

        var high = Math.Min(map.HighHz, 0.45 * strain.SampleRateHz);
        var cond = conditioning ?? new ConditioningOptions(LowHz: map.LowHz, HighHz: high);
        var white = Conditioning.Condition(strain, cond);
        var options = map with { HighHz = high };
        var q = QTransform.Compute(white.Data, center.AddSeconds(-beforeSeconds), center.AddSeconds(afterSeconds), center, options);
        double peak = q.Loudest().TimeSeconds;
        double from = Math.Max(-beforeSeconds, peak - 0.4), to = Math.Min(afterSeconds, peak + 0.1);
        var zoom = to - from > 0.05
            ? QTransform.Compute(white.Data, center.AddSeconds(from), center.AddSeconds(to), center, options, 200, 120)
            : q;
        return new ChirpAnalysisResult(q, zoom, ChirpTrack.Fit(q, track));
    }
}
