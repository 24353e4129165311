namespace EventReview.Core.Records;

/// <summary>
/// One row a timeline entry added. <see cref="Part"/> is "evidence", "computation", "signoff" or "configuration";
/// <see cref="Seal"/> is the row's seal (for a configuration record: its id); <see cref="Detail"/> what else
/// the fact says (evidence: the detail hash; configuration: "fingerprint detail"); the entry's kind, actor and time name
/// the row in messages.
/// </summary>
public sealed class RecordedRow(string part, string? item, string seal, string detail, int entry, string entryKind, string actorName, long atUtcTicks)
{
    /// <summary>What kind of row: "evidence", "computation", "signoff" or "configuration".</summary>
    public string Part { get; } = part;

    /// <summary>Key of the checklist item the row was added to; null for a configuration record.</summary>
    public string? Item { get; } = item;

    /// <summary>The row's seal (lowercase hex SHA-256), or a configuration record's id.</summary>
    public string Seal { get; } = seal;

    /// <summary>What else the fact records: the evidence's detail hash, a configuration record's "fingerprint detail"; else empty.</summary>
    public string Detail { get; } = detail;

    /// <summary>Sequence number of the timeline entry that added the row.</summary>
    public int Entry { get; } = entry;

    /// <summary>Dotted kind of that entry ("evidence.note", "signoff", ...).</summary>
    public string EntryKind { get; } = entryKind;

    /// <summary>Printed name of whoever made that entry.</summary>
    public string ActorName { get; } = actorName;

    /// <summary>Time of that entry, UTC ticks (100 ns since 0001-01-01).</summary>
    public long AtUtcTicks { get; } = atUtcTicks;

    /// <summary>For a sign-off made stale: the UTC ticks of the mark and the entry that recorded it.</summary>
    public (long SinceUtcTicks, int Entry)? Stale { get; internal set; }
}
