using EventReview.Core.Verdicts;

namespace EventReview.Core.Timing;

/// <summary>
/// Result of <see cref="TimingCheck.Run"/>. <see cref="Judgement"/> is consistent when every pair lies within its allowed window
/// and, for four or more sites, the chi-square of the best sky direction (each site's residual in units of its timing uncertainty)
/// has a p-value of at least <see cref="FalseAlarmProbability"/> with <see cref="DegreesOfFreedom"/> = arrivals − 3. Three sites have
/// 0 degrees of freedom: when their rings meet no residual test is possible (<see cref="PValue"/> null); when they do not, the miss
/// is judged with one degree of freedom as a bound (<see cref="PValueIsBound"/>). <see cref="Sky"/> is sorted best first (empty for
/// two sites), RA/Dec in the frame named by <see cref="SkyFrame"/>. <see cref="Utc"/> is the UTC of the earliest arrival (ISO 8601,
/// 23:59:60 during a leap second); <see cref="GmstDegrees"/> the Greenwich mean sidereal time used for RA/Dec (UT1 taken as UTC).
/// <see cref="Verdict"/> and <see cref="Consistent"/> repeat the judgement's word and outcome (fields of record format 1).
/// </summary>
public sealed record TimingCheckResult(
    string Verdict,
    bool Consistent,
    double KSigma,
    IReadOnlyList<PairTiming> Pairs,
    IReadOnlyList<SkySolution> Sky,
    bool? RingsMeet,
    double? MinimalResidualSeconds,
    string SkyNote,
    string EarliestArrivalGps,
    string Utc,
    double GmstDegrees,
    IReadOnlyList<string> Assumptions,
    IReadOnlyList<string> Warnings,
    double? Chi2 = null,
    int? DegreesOfFreedom = null,
    double? PValue = null,
    bool PValueIsBound = false,
    double FalseAlarmProbability = TimingOptions.DefaultFalseAlarmProbability,
    string? SkyFrame = null,
    Judgement? Judgement = null);
