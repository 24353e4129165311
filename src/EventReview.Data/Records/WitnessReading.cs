namespace EventReview.Data.Records;

/// <summary>
/// What the witness file holds: the newest witnessed head of each chain (with when it was written), how many lines
/// were read, and what was wrong with the file (unreadable lines, lines whose signature does not verify).
/// </summary>
public sealed record WitnessReading(string Path, bool Exists, long Lines, DateTimeOffset? LastAt,
    IReadOnlyDictionary<string, (WitnessedHead Head, string At)> Newest, IReadOnlyList<string> Problems);
