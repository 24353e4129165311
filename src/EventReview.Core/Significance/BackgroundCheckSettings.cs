using EventReview.Core.Time;

namespace EventReview.Core.Significance;

/// <summary>Settings of <see cref="BackgroundCheck"/> shared by every pair and the triple.</summary>
public sealed record BackgroundCheckSettings
{
    /// <summary>Slide step, s (at least <see cref="BackgroundPlanner.MinStepOverWindow"/> x every window).</summary>
    public required double StepSeconds { get; init; }

    /// <summary>K: slides k = ±1..±K.</summary>
    public required int Slides { get; init; }

    /// <summary>Observing time for the FAP, s; null: each pair's (or the triple's) zero-lag coincident analysed time.</summary>
    public double? ObservingTimeSeconds { get; init; }

    /// <summary>Also report the figures without the candidate's own triggers in the background.</summary>
    public bool RemoveCandidateTriggers { get; init; }

    /// <summary>Arrival time per site code; a pair's candidate is the zero-lag coincidence nearest its first site's arrival.</summary>
    public IReadOnlyDictionary<string, GpsTime> Arrivals { get; init; } = new Dictionary<string, GpsTime>();

    /// <summary>Candidate time used where a site has no arrival; null: the loudest zero-lag coincidence.</summary>
    public GpsTime? CandidateTime { get; init; }

    /// <summary>Optional relative chirp-mass agreement cut.</summary>
    public double? ChirpMassRelativeTolerance { get; init; }

    /// <summary>Ranking statistic of a three-site candidate; null: the zero-lag triple nearest the candidate time.</summary>
    public double? TripleStatistic { get; init; }

    /// <summary>Where <see cref="TripleStatistic"/> came from, in words.</summary>
    public string TripleStatisticRule { get; init; } = "the zero-lag triple nearest the candidate time";

    /// <summary>Loudest background coincidences kept per pair.</summary>
    public int LoudestCount { get; init; } = 20;

    /// <summary>Curve points kept per pair.</summary>
    public int CurvePoints { get; init; } = 150;
}
