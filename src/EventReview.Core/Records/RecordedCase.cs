namespace EventReview.Core.Records;

/// <summary>
/// What a case's stored rows must be according to its signed timeline (built by <see cref="CaseReplay"/>): every field
/// with its value and the entry that set it last, and every row the timeline added (evidence, computation records,
/// sign-offs with their stale marks, frozen configuration records).
/// </summary>
public sealed class RecordedCase
{
    /// <summary>Field facts (case, arrivals, items) by name: the value and the entry that recorded it.</summary>
    public Dictionary<string, (string Value, int Entry)> Fields { get; } = new(StringComparer.Ordinal);

    /// <summary>Rows added by the timeline, in the order they were added.</summary>
    public List<RecordedRow> Rows { get; } = [];

    /// <summary>Problems met while replaying (an unreadable or unknown fact), by entry.</summary>
    public List<(int Entry, string What)> Problems { get; } = [];

    /// <summary>Entries that carry no facts (written before facts were recorded); their changes cannot be recomputed.</summary>
    public List<int> WithoutFacts { get; } = [];

    /// <summary>Sequence and UTC ticks of the newest entry replayed (0 when none).</summary>
    public int LastEntry { get; internal set; }

    public long LastAtUtcTicks { get; internal set; }
}
