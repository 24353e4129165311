namespace EventReview.Core.Evidence;

/// <summary>
/// One computation record as it enters the evidence fingerprint, in plain values: <paramref name="ContentSha256"/>
/// is <see cref="ComputationRecord.ContentSha256"/> (see <see cref="ComputationRecord.ComputeContentSha256"/>) and
/// <paramref name="RunUtcTicks"/> the run time as UTC ticks (100 ns since 0001-01-01 UTC).
/// </summary>
public sealed record ComputationLine(string ContentSha256, long RunUtcTicks);
