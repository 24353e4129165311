namespace EventReview.Web.Services.Checks;

/// <summary>
/// Parameters of the time-slide background check as run from a case. Every site pair of the chosen sites is analysed
/// separately (the first site by code stays, the second slides); for exactly three sites the three-site background and
/// the joint significance are added (Core's <see cref="Core.Significance.BackgroundCheck"/>).
/// </summary>
/// <param name="Sites">Per site, the trigger and segment files (two or more sites, each among the case's arrivals).</param>
/// <param name="WindowMs">Coincidence window ± in ms for every pair; null = each pair's light-travel time + <paramref name="ToleranceMs"/>.</param>
/// <param name="ToleranceMs">Timing tolerance added to the light-travel time when the window is not given, in ms.</param>
/// <param name="StepSeconds">Slide step in s; must be much longer than the window (at least <see cref="EventReview.Core.Significance.BackgroundPlanner.MinStepOverWindow"/> × window).</param>
/// <param name="SlidesK">K: slides k = ±1..±K (2K slides per pair; default 5,000, enough for the 90 % bound of a joint
/// three-site figure over a few days of data to pass 3σ).</param>
/// <param name="CandidateStatistic">Ranking statistic of the candidate for every pair; null = each pair's network SNR from the case's
/// arrivals (and, for three sites, the three-site network SNR for the triple).</param>
/// <param name="ObservingTimeSeconds">Observing time for the false-alarm probability in s; null = each pair's zero-lag coincident analysed time.</param>
/// <param name="RemoveCandidateTriggers">Also report the figures with the candidate's own triggers taken out of the background.</param>
public sealed record BackgroundCheckParameters(
    IReadOnlyList<BackgroundSiteFiles> Sites,
    double? WindowMs = null,
    double ToleranceMs = 5.0,
    double StepSeconds = 5.0,
    int SlidesK = 5000,
    double? CandidateStatistic = null,
    double? ObservingTimeSeconds = null,
    bool RemoveCandidateTriggers = true)
{
    /// <summary>Longest slide step accepted, s (about 116 days, longer than any analysed stretch).</summary>
    public const double MaxStepSeconds = 1e7;

    /// <summary>Largest ranking statistic accepted (SNR-like statistics are far below it).</summary>
    public const double MaxCandidateStatistic = 1e6;

    /// <summary>Longest observing time accepted, s (about a century).</summary>
    public const double MaxObservingTimeSeconds = 3.2e9;

    /// <summary>Largest K accepted from the app (2K slides per pair).</summary>
    public const int MaxSlidesK = 100_000;

    /// <exception cref="ArgumentException">When a value is out of range (message names it).</exception>
    public void Validate()
    {
        if (Sites is null || Sites.Count < 2)
        {
            throw new ArgumentException("Pick trigger and segment files for at least two sites.", nameof(Sites));
        }

        foreach (var s in Sites)
        {
            if (string.IsNullOrWhiteSpace(s.TriggersSha256) || string.IsNullOrWhiteSpace(s.SegmentsSha256))
            {
                throw new ArgumentException($"Site {s.SiteCode}: pick both a trigger file and a segment file.", nameof(Sites));
            }
        }

        if (Sites.Select(s => s.SiteCode.ToUpperInvariant()).Distinct().Count() != Sites.Count)
        {
            throw new ArgumentException("Each site may appear only once.", nameof(Sites));
        }

        if (WindowMs is { } w && (!double.IsFinite(w) || w <= 0 || w > 1000))
        {
            throw new ArgumentException("The coincidence window must be > 0 and at most 1000 ms.", nameof(WindowMs));
        }

        if (!double.IsFinite(ToleranceMs) || ToleranceMs < 0 || ToleranceMs > 1000)
        {
            throw new ArgumentException("The timing tolerance must be between 0 and 1000 ms.", nameof(ToleranceMs));
        }

        if (!double.IsFinite(StepSeconds) || StepSeconds <= 0 || StepSeconds > MaxStepSeconds)
        {
            throw new ArgumentException($"The slide step must be a positive number of seconds, at most {MaxStepSeconds:0.#e0} s.", nameof(StepSeconds));
        }

        if (SlidesK < 1 || SlidesK > MaxSlidesK)
        {
            throw new ArgumentException($"K (slides each way) must be between 1 and {MaxSlidesK:N0}.", nameof(SlidesK));
        }

        if (CandidateStatistic is { } x && (!double.IsFinite(x) || x <= 0 || x > MaxCandidateStatistic))
        {
            throw new ArgumentException($"The candidate's ranking statistic must be a positive number, at most {MaxCandidateStatistic:0.#e0}.", nameof(CandidateStatistic));
        }

        if (ObservingTimeSeconds is { } t && (!double.IsFinite(t) || t <= 0 || t > MaxObservingTimeSeconds))
        {
            throw new ArgumentException($"The observing time must be a positive number of seconds, at most {MaxObservingTimeSeconds:0.#e0} s (about a century).", nameof(ObservingTimeSeconds));
        }
    }
}
