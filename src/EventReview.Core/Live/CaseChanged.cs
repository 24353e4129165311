namespace EventReview.Core.Live;

/// <summary>
/// That a case changed: its candidate id and the sequence number of the newest timeline entry a committed write added.
/// It carries ids only; whoever receives it reads the change itself through the normal, authorised queries.
/// </summary>
/// <param name="CandidateId">The case's candidate id (its chain is <c>case:</c> + this id).</param>
/// <param name="Sequence">Sequence number (1, 2, ...) of the newest committed timeline entry of the case.</param>
public sealed record CaseChanged(string CandidateId, int Sequence);
