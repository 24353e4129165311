using EventReview.Core.Signal.Overlap;

namespace EventReview.Web.Services.Checks;

/// <summary>What an overlap computation record stores as its result.</summary>
/// <param name="SiteA">Site code of A (the reference).</param>
/// <param name="SiteB">Site code of B (shifted and possibly flipped to line up with A).</param>
/// <param name="FileA">File name of A's strain.</param>
/// <param name="FileB">File name of B's strain.</param>
/// <param name="Overlap">The core overlap result (lags are arrival(A) − arrival(B), seconds).</param>
/// <param name="AllowedLagSeconds">Allowed (and searched) |lag|, seconds.</param>
/// <param name="AllowedLagRule">How the allowed lag was set, in words.</param>
/// <param name="CaseLagSeconds">arrival(A) − arrival(B) from the case's arrivals, seconds (null when a site has no arrival).</param>
/// <param name="LagWithinWindow">True when |refined lag| ≤ allowed and the peak is not on the edge of the searched range.</param>
/// <param name="PeakAtSearchEdge">True when the best lag is the first or last searched lag (the real peak may lie outside).</param>
/// <param name="OverlapThreshold">Smallest |overlap| called consistent.</param>
/// <param name="PValueThreshold">Largest p-value called consistent.</param>
/// <param name="SignNote">Which sign was chosen and what the other sign gives, in words.</param>
/// <param name="VerdictReason">Why the verdict is what it is.</param>
/// <param name="Maps">Time-frequency map and chirp fit per site (A then B).</param>
/// <param name="Assumptions">Assumptions of the record (the core's own are in <see cref="OverlapResult.Assumptions"/>).</param>
public sealed record OverlapRecordResult(
    string SiteA,
    string SiteB,
    string FileA,
    string FileB,
    OverlapResult Overlap,
    double AllowedLagSeconds,
    string AllowedLagRule,
    double? CaseLagSeconds,
    bool LagWithinWindow,
    bool PeakAtSearchEdge,
    double OverlapThreshold,
    double PValueThreshold,
    string SignNote,
    string VerdictReason,
    IReadOnlyList<OverlapSiteMap> Maps,
    IReadOnlyList<string> Assumptions);
