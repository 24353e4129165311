using System.Text.Json.Serialization;
using EventReview.Core.Antenna;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Timing;

/// <summary>
/// The timing check kind's result, as stored in a computation record: the timing check, the antenna-response test when an
/// observation was given, and the one judgement of the two. <see cref="Judgement"/> is null only in records of format 1 (their
/// verdict word is on the record itself). <see cref="Summary"/> and <see cref="PictureSvg"/> are not stored in the result JSON.
/// </summary>
/// <param name="Timing">Pairs, sky directions and the chi-square sky test.</param>
/// <param name="Antenna">The antenna-response test of the observed sign and ratio, or null.</param>
/// <param name="Judgement">Verdict and reason of the whole check.</param>
public sealed record TimingReviewResult(TimingCheckResult Timing, AntennaConsistencyResult? Antenna, Judgement? Judgement)
{
    /// <summary>One line with the key numbers, units and the rule they were judged against.</summary>
    [JsonIgnore]
    public string Summary { get; init; } = string.Empty;

    /// <summary>The pictures (SVG, separated by <c>CheckRecords.PictureSeparator</c>): the all-sky map with rings, directions and the antenna-allowed cells, then the network map of the sites used.</summary>
    [JsonIgnore]
    public string PictureSvg { get; init; } = string.Empty;
}
