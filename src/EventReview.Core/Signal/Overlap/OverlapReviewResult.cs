using System.Text.Json.Serialization;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// The overlap check kind's result, as stored in a computation record (the field names of record format 1 are kept, so old records
/// still read; fields added in format 2 are null or empty in them). <see cref="Summary"/> and <see cref="PicturesSvg"/> are not
/// part of the stored result JSON.
/// </summary>
/// <param name="SiteA">Site code of A (the reference).</param>
/// <param name="SiteB">Site code of B (shifted and turned to line up with A).</param>
/// <param name="FileA">File name of A's strain.</param>
/// <param name="FileB">File name of B's strain.</param>
/// <param name="Overlap">The core overlap result (lags are arrival(A) − arrival(B), seconds).</param>
/// <param name="AllowedLagSeconds">Allowed (and searched) |lag|, seconds.</param>
/// <param name="AllowedLagRule">How the allowed lag was set, in words.</param>
/// <param name="CaseLagSeconds">arrival(A) − arrival(B) from the case's arrivals, seconds (null when not known).</param>
/// <param name="LagWithinWindow">True when |refined lag| ≤ allowed and the peak is not at the edge of the searched range.</param>
/// <param name="PeakAtSearchEdge">True when the best lag is within one sample of the search limit (the real peak may lie outside).</param>
/// <param name="OverlapThreshold">Smallest overlap called consistent.</param>
/// <param name="PValueThreshold">Largest p-value called consistent.</param>
/// <param name="SignNote">The phase, the sign it implies (or that it leaves the sign undetermined), in words.</param>
/// <param name="VerdictReason">Why the verdict is what it is (the judgement's reason).</param>
/// <param name="Maps">Time-frequency map and chirp fit per site (A then B).</param>
/// <param name="Assumptions">Assumptions of the record (the core's own are in <see cref="OverlapResult.Assumptions"/>).</param>
/// <param name="Judgement">Verdict and reason (format 2; in format 1 the word is on the record).</param>
public sealed record OverlapReviewResult(
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
    IReadOnlyList<string> Assumptions,
    Judgement? Judgement = null)
{
    /// <summary>One line with the key numbers, their uncertainty and the window they were judged against.</summary>
    [JsonIgnore]
    public string Summary { get; init; } = string.Empty;

    /// <summary>The pictures: overlay, correlation curve, off-source histogram, then each site's Q map and its zoom.</summary>
    [JsonIgnore]
    public IReadOnlyList<string> PicturesSvg { get; init; } = [];
}
