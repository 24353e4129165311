using System.Globalization;
using EventReview.Core.Evidence;

namespace EventReview.Core.Cases;

/// <summary>
/// One entry of a case's timeline. Entries form a hash chain per case: <see cref="Hash"/> is the SHA-256 of the
/// canonical content (see <see cref="CanonicalContent"/>), which includes the previous entry's hash, so any later
/// edit, deletion or reordering breaks the chain from that entry on. Entries are never updated or deleted.
/// </summary>
public sealed class ActivityEntry
{
    /// <summary>Hash that stands before the first entry of every case (64 zeros).</summary>
    public const string GenesisHash = "0000000000000000000000000000000000000000000000000000000000000000";

    private ActivityEntry()
    {
        CandidateId = string.Empty;
        ActorId = string.Empty;
        ActorName = string.Empty;
        Kind = string.Empty;
        Text = string.Empty;
        PreviousHash = string.Empty;
        Hash = string.Empty;
    }

    internal ActivityEntry(string candidateId, int sequence, DateTimeOffset at, Actor actor, string kind, string? itemKey, string text, string previousHash)
    {
        CandidateId = candidateId;
        Sequence = sequence;
        At = Time.RecordedTime.Normalize(at);
        ActorId = actor.UserId;
        ActorName = actor.DisplayName;
        Kind = kind;
        ItemKey = itemKey;
        Text = text;
        PreviousHash = previousHash;
        Hash = ComputeHash(candidateId, sequence, At, ActorId, ActorName, kind, itemKey, text, previousHash);
    }

    public long Id { get; private set; }

    public int ReviewCaseId { get; private set; }

    /// <summary>The case's candidate identifier (part of the hashed content, so entries cannot move between cases).</summary>
    public string CandidateId { get; private set; }

    /// <summary>1, 2, 3, ... within the case.</summary>
    public int Sequence { get; private set; }

    /// <summary>When, UTC, to whole milliseconds (<see cref="Time.RecordedTime"/>).</summary>
    public DateTimeOffset At { get; private set; }

    public string ActorId { get; private set; }

    public string ActorName { get; private set; }

    /// <summary>Dotted kind ("case.opened", "item.state", "evidence.note", "signoff", ...).</summary>
    public string Kind { get; private set; }

    public string? ItemKey { get; private set; }

    public string Text { get; private set; }

    public string PreviousHash { get; private set; }

    public string Hash { get; private set; }

    /// <summary>
    /// Canonical content, version 1: the lines <c>eventreview-activity-v1</c>, candidate id, sequence, UTC time as
    /// round-trip ISO 8601 with 7 fractional digits, actor id, actor name, kind, item key (empty if none), text,
    /// previous hash; joined by '\n'.
    /// </summary>
    public string CanonicalContent() =>
        ComputeCanonicalContent(CandidateId, Sequence, At, ActorId, ActorName, Kind, ItemKey, Text, PreviousHash);

    /// <summary>True when the stored hash matches the content.</summary>
    public bool HashMatches() => string.Equals(Hash,
        ComputeHash(CandidateId, Sequence, At, ActorId, ActorName, Kind, ItemKey, Text, PreviousHash), StringComparison.Ordinal);

    /// <summary>
    /// The canonical content (see <see cref="CanonicalContent"/>) from plain values, for offline verification.
    /// <paramref name="at"/> is converted to UTC; a null <paramref name="itemKey"/> is written as an empty line.
    /// </summary>
    public static string ComputeCanonicalContent(string candidateId, int sequence, DateTimeOffset at, string actorId, string actorName,
        string kind, string? itemKey, string text, string previousHash) => string.Join('\n',
        "eventreview-activity-v1",
        candidateId,
        sequence.ToString(CultureInfo.InvariantCulture),
        FormatUtc(at),
        actorId,
        actorName,
        kind,
        itemKey ?? string.Empty,
        text,
        previousHash);

    /// <summary>The entry hash from plain values: lowercase hex SHA-256 of the UTF-8 canonical content.</summary>
    public static string ComputeHash(string candidateId, int sequence, DateTimeOffset at, string actorId, string actorName,
        string kind, string? itemKey, string text, string previousHash) =>
        Hashing.Sha256Hex(ComputeCanonicalContent(candidateId, sequence, at, actorId, actorName, kind, itemKey, text, previousHash));

    /// <summary>The time as written in the canonical content: UTC, <c>yyyy-MM-ddTHH:mm:ss.fffffffZ</c>.</summary>
    public static string FormatUtc(DateTimeOffset at) =>
        at.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'", CultureInfo.InvariantCulture);
}
