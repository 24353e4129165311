using System.Globalization;
using System.Text;
using EventReview.Core.Evidence;
using EventReview.Core.Records;

namespace EventReview.Core.Cases;

/// <summary>
/// One entry of a case's timeline. Entries form a hash chain per case: <see cref="Hash"/> is the SHA-256 of the
/// canonical content (see <see cref="CanonicalContent"/>), which includes the previous entry's hash, so any later
/// edit, deletion or reordering breaks the chain from that entry on. Each entry also carries the facts of its change
/// (<see cref="Facts"/>, replayed by <see cref="CaseReplay"/>) and a MAC under the server's record key
/// (<see cref="Mac"/>), so that the chain cannot be recomputed by someone without the key. Entries are never updated or deleted.
/// </summary>
public sealed class TimelineEntry
{
    /// <summary>Hash that stands before the first entry of every case (64 zeros).</summary>
    public const string GenesisHash = "0000000000000000000000000000000000000000000000000000000000000000";

    private TimelineEntry()
    {
        CandidateId = string.Empty;
        ActorId = string.Empty;
        ActorName = string.Empty;
        Kind = string.Empty;
        Text = string.Empty;
        PreviousHash = string.Empty;
        Hash = string.Empty;
    }

    internal TimelineEntry(string candidateId, int sequence, DateTimeOffset at, Actor actor, string kind, string? itemKey, string text, string previousHash,
        IEnumerable<Fact> facts)
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
        Facts = FactText.Format(facts);
        Hash = ComputeHash(candidateId, sequence, At, ActorId, ActorName, kind, itemKey, text, Facts, previousHash);
    }

    /// <summary>Database key of the entry (not part of the hashed content).</summary>
    public long Id { get; private set; }

    /// <summary>Database key of the case the entry belongs to (not part of the hashed content).</summary>
    public int ReviewCaseId { get; private set; }

    /// <summary>The case's candidate identifier (part of the hashed content, so entries cannot move between cases).</summary>
    public string CandidateId { get; private set; }

    /// <summary>1, 2, 3, ... within the case.</summary>
    public int Sequence { get; private set; }

    /// <summary>When, UTC, to whole milliseconds (<see cref="Time.RecordedTime"/>).</summary>
    public DateTimeOffset At { get; private set; }

    /// <summary>Account id of whoever made the change (<see cref="Actor.UserId"/>).</summary>
    public string ActorId { get; private set; }

    /// <summary>Printed name of whoever made the change, as it was at the time (<see cref="Actor.DisplayName"/>).</summary>
    public string ActorName { get; private set; }

    /// <summary>Dotted kind ("case.opened", "item.state", "evidence.note", "signoff", ...).</summary>
    public string Kind { get; private set; }

    /// <summary>Key of the checklist item the change concerns; null for a change of the case itself.</summary>
    public string? ItemKey { get; private set; }

    /// <summary>The change in plain language, as the timeline shows it.</summary>
    public string Text { get; private set; }

    /// <summary><see cref="Hash"/> of the case's previous entry, or <see cref="GenesisHash"/> for the first entry.</summary>
    public string PreviousHash { get; private set; }

    /// <summary>Lowercase hex SHA-256 of this entry's canonical content, which includes <see cref="PreviousHash"/>.</summary>
    public string Hash { get; private set; }

    /// <summary>
    /// The facts of the change in <see cref="FactText"/> form (what the stored fields became, seals of the rows added);
    /// null only for entries written before facts were recorded (canonical content version 1).
    /// </summary>
    public string? Facts { get; private set; }

    /// <summary>Fingerprint of the record key whose MAC the entry carries; null when not signed.</summary>
    public string? KeyId { get; private set; }

    /// <summary>HMAC-SHA-256 (lowercase hex) of <see cref="EntryMac.Input"/> under the record key; null when not signed.</summary>
    public string? Mac { get; private set; }

    /// <summary>The chain name the MAC covers (<see cref="EntryMac.CaseChain"/>).</summary>
    public string Chain => EntryMac.CaseChain(CandidateId);

    /// <summary>Signs the entry with <paramref name="signer"/> (once, before it is stored).</summary>
    /// <exception cref="InvalidOperationException">When it is already signed.</exception>
    public void Authenticate(IRecordSigner signer)
    {
        ArgumentNullException.ThrowIfNull(signer);
        if (KeyId is not null)
        {
            throw new InvalidOperationException($"Timeline entry {Sequence} of {CandidateId} is already signed.");
        }

        KeyId = signer.KeyId;
        Mac = signer.Mac(EntryMac.Input(KeyId, Chain, Hash));
    }

    /// <summary>Checks the MAC against <paramref name="keys"/>: true or false, or null when the entry is unsigned or its key is not in the ring.</summary>
    public bool? MacMatches(IRecordKeyRing keys)
    {
        ArgumentNullException.ThrowIfNull(keys);
        return KeyId is null || Mac is null ? null : keys.MacMatches(KeyId, EntryMac.Input(KeyId, Chain, Hash), Mac);
    }

    /// <summary>
    /// Canonical content. Version 1 (entries without facts): the lines <c>eventreview-activity-v1</c>, candidate id,
    /// sequence, UTC time as round-trip ISO 8601 with 7 fractional digits, actor id, actor name, kind, item key (empty if
    /// none), text, previous hash; joined by '\n'. Version 2 (entries with facts): the line <c>eventreview-activity-v2</c>
    /// followed by candidate id, sequence, UTC time, actor id, actor name, kind, item key, text, facts and previous hash,
    /// each written as its length in UTF-16 code units, ':', the value and '\n' (so no field can spill into the next).
    /// </summary>
    public string CanonicalContent() =>
        ComputeCanonicalContent(CandidateId, Sequence, At, ActorId, ActorName, Kind, ItemKey, Text, Facts, PreviousHash);

    /// <summary>True when the stored hash matches the content.</summary>
    public bool HashMatches() => string.Equals(Hash,
        ComputeHash(CandidateId, Sequence, At, ActorId, ActorName, Kind, ItemKey, Text, Facts, PreviousHash), StringComparison.Ordinal);

    /// <summary>
    /// The canonical content (see <see cref="CanonicalContent"/>) from plain values, for offline verification.
    /// <paramref name="at"/> is converted to UTC; a null <paramref name="itemKey"/> is written as an empty line.
    /// </summary>
    public static string ComputeCanonicalContent(string candidateId, int sequence, DateTimeOffset at, string actorId, string actorName,
        string kind, string? itemKey, string text, string? facts, string previousHash)
    {
        if (facts is null)
        {
            return CanonicalV1(candidateId, sequence, at, actorId, actorName, kind, itemKey, text, previousHash);
        }

        // "activity" is the record's old word, kept on purpose: this tag is inside every stored hash, so changing it would
        // make every existing entry fail verification (docs/decisions/013-one-word-timeline.md).
        var sb = new StringBuilder("eventreview-activity-v2\n");
        foreach (var field in new[] { candidateId, sequence.ToString(CultureInfo.InvariantCulture), FormatUtc(at), actorId, actorName, kind, itemKey ?? string.Empty, text, facts, previousHash })
        {
            sb.Append(field.Length.ToString(CultureInfo.InvariantCulture)).Append(':').Append(field).Append('\n');
        }

        return sb.ToString();
    }

    private static string CanonicalV1(string candidateId, int sequence, DateTimeOffset at, string actorId, string actorName,
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
        string kind, string? itemKey, string text, string? facts, string previousHash) =>
        Hashing.Sha256Hex(ComputeCanonicalContent(candidateId, sequence, at, actorId, actorName, kind, itemKey, text, facts, previousHash));

    /// <summary>The time as written in the canonical content: UTC, <c>yyyy-MM-ddTHH:mm:ss.fffffffZ</c>.</summary>
    public static string FormatUtc(DateTimeOffset at) =>
        at.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'", CultureInfo.InvariantCulture);
}
