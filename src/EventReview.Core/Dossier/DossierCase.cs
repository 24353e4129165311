namespace EventReview.Core.Dossier;

/// <summary>
/// The case summary. <paramref name="State"/> and <paramref name="Outcome"/> are the plain words of
/// <see cref="Checklists.StateNames"/>; <paramref name="NetworkSnr"/> is the root sum of squares of the site SNRs.
/// </summary>
public sealed record DossierCase(
    string CandidateId,
    long GpsNanoseconds,
    string Gps,
    string Search,
    string Summary,
    string State,
    string? Outcome,
    string? ClosingStatement,
    string CoordinatorId,
    string CoordinatorName,
    string ChecklistName,
    int ChecklistVersion,
    string CreatedAtUtc,
    long CreatedAtUtcTicks,
    string UpdatedAtUtc,
    long UpdatedAtUtcTicks,
    double NetworkSnr,
    int ItemCount,
    int SignedItemCount,
    int StaleItemCount);
