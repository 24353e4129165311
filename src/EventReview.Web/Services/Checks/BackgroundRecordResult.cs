using EventReview.Core.Significance;

namespace EventReview.Web.Services.Checks;

/// <summary>What a background computation record stores as its result (record format 2; format-1 records have no "format").</summary>
/// <param name="Format">Record format (<see cref="Core.Verdicts.RecordFormat"/>); 0 when read from a format-1 record.</param>
/// <param name="Sites">Per site, the files read and the triggers dropped.</param>
/// <param name="Check">Core's result: every pair, for three sites the triple and the joint figure, the verdict and the method.</param>
public sealed record BackgroundRecordResult(int Format, IReadOnlyList<BackgroundSiteInput> Sites, BackgroundCheckResult Check);
