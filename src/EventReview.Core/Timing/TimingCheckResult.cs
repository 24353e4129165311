namespace EventReview.Core.Timing;

/// <summary>
/// Result of <see cref="TimingCheck.Run"/>. <see cref="Verdict"/> is "consistent" when every pair lies within its allowed window and,
/// for three or more sites, the best sky direction's RMS residual is within k × the RMS site timing uncertainty
/// (<see cref="SkyResidualAllowedSeconds"/>). <see cref="Sky"/> is sorted best first (empty for two sites). <see cref="Utc"/> is the
/// UTC of the earliest arrival (ISO 8601, 23:59:60 during a leap second); <see cref="GmstDegrees"/> the Greenwich mean sidereal
/// time used for RA/Dec (UT1 taken as UTC). <see cref="SkyNote"/> says whether the rings meet and, if not, by how much.
/// </summary>
public sealed record TimingCheckResult(
    string Verdict,
    bool Consistent,
    double KSigma,
    IReadOnlyList<PairTiming> Pairs,
    IReadOnlyList<SkySolution> Sky,
    bool? RingsMeet,
    double? MinimalResidualSeconds,
    double? SkyResidualAllowedSeconds,
    string SkyNote,
    string EarliestArrivalGps,
    string Utc,
    double GmstDegrees,
    IReadOnlyList<string> Assumptions,
    IReadOnlyList<string> Warnings);
