namespace EventReview.Core.Records;

/// <summary>
/// One row a timeline entry added. <see cref="Part"/> is "evidence", "computation", "signoff" or "configuration";
/// <see cref="Seal"/> is the row's seal (for a configuration record: its id); <see cref="Detail"/> what else
/// the fact says (evidence: the detail hash; configuration: "fingerprint detail"); the entry's kind, actor and time name
/// the row in messages.
/// </summary>
public sealed class RecordedRow(string part, string? item, string seal, string detail, int entry, string entryKind, string actorName, long atUtcTicks)
{
    public string Part { get; } = part;

    public string? Item { get; } = item;

    public string Seal { get; } = seal;

    public string Detail { get; } = detail;

    public int Entry { get; } = entry;

    public string EntryKind { get; } = entryKind;

    public string ActorName { get; } = actorName;

    public long AtUtcTicks { get; } = atUtcTicks;

    /// <summary>For a sign-off made stale: the UTC ticks of the mark and the entry that recorded it.</summary>
    public (long SinceUtcTicks, int Entry)? Stale { get; internal set; }
}
