namespace EventReview.Core.Evidence;

/// <summary>
/// One note, attachment or link as it enters the evidence fingerprint, in plain values (for offline verification
/// without the entities). <paramref name="Kind"/> is the lower-case kind ("note", "attachment", "link");
/// <paramref name="ContentSha256"/> the lowercase hex SHA-256 of the content; <paramref name="AddedUtcTicks"/> the
/// time it was added as UTC ticks (100 ns since 0001-01-01 UTC).
/// </summary>
public sealed record EvidenceLine(string Kind, string ContentSha256, long AddedUtcTicks);
