namespace EventReview.Core.Dossier;

/// <summary>
/// A timeline entry with every field its hash covers (see <see cref="Cases.TimelineEntry.ComputeHash"/>; the case's
/// candidate id is <see cref="DossierCase.CandidateId"/>). <paramref name="AtUtc"/> is exactly the text hashed.
/// Schema 2 adds the entry's <paramref name="Facts"/> (hashed with canonical content version 2; null for version 1
/// entries), and the fingerprint of the record key and the MAC it carries (checkable only with the server's key).
/// </summary>
public sealed record DossierTimelineEntry(
    int Sequence,
    string AtUtc,
    long AtUtcTicks,
    string ActorId,
    string ActorName,
    string Kind,
    string? ItemKey,
    string Text,
    string PreviousHash,
    string Hash,
    string? Facts = null,
    string? KeyId = null,
    string? Mac = null);
