namespace EventReview.Core.Dossier;

/// <summary>
/// A timeline entry with every field its hash covers (see <see cref="Cases.ActivityEntry.ComputeHash"/>; the case's
/// candidate id is <see cref="DossierCase.CandidateId"/>). <paramref name="AtUtc"/> is exactly the text hashed.
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
    string Hash);
