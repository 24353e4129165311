using EventReview.Core.Time;

namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Conditioning, time-frequency map and chirp fit of one site around a candidate, in one call.</summary>
public static class ChirpAnalysis
{
    /// <summary>
    /// Whitens and band-passes <paramref name="strain"/> (band from the map options, default 20-500 Hz), maps
    /// [center − beforeSeconds, center + afterSeconds] and fits the chirp track. Times in the result are relative to the centre.
    /// </summary>
    public static (TimeFrequencyMap Map, ChirpFit Fit) Run(TimeSeries strain, GpsTime center, double beforeSeconds = 2, double afterSeconds = 0.2,
        SpectrogramOptions? map = null, ChirpTrackOptions? track = null, ConditioningOptions? conditioning = null)
    {
        ArgumentNullException.ThrowIfNull(strain);
        map ??= new SpectrogramOptions();
        if (!(beforeSeconds >= 0) || !(afterSeconds >= 0) || beforeSeconds + afterSeconds <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(beforeSeconds), beforeSeconds, "The span before and after the centre must be non-negative and not both zero (s).");
        }

        var cond = conditioning ?? new ConditioningOptions(LowHz: map.LowHz, HighHz: Math.Min(map.HighHz, 0.45 * strain.SampleRateHz));
        var white = Conditioning.Condition(strain, cond);
        var m = Spectrogram.Compute(white.Data, center.AddSeconds(-beforeSeconds), center.AddSeconds(afterSeconds), center, map);
        return (m, ChirpTrack.Fit(m, track));
    }
}
