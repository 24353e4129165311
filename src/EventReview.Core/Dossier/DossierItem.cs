namespace EventReview.Core.Dossier;

/// <summary>
/// One checklist item with its guidance (Markdown), evidence, computation records and sign-offs.
/// <paramref name="Fingerprint"/> is the item's current evidence fingerprint; it is recomputable from
/// <paramref name="Evidence"/>, <paramref name="Computations"/> and <paramref name="ConfigurationFingerprint"/>
/// (null when the item's fingerprint binds no frozen configuration) with <see cref="Evidence.EvidenceFingerprint"/>.
/// </summary>
public sealed record DossierItem(
    string Key,
    string SectionKey,
    string SectionTitle,
    int SectionOrder,
    int Order,
    string Title,
    string Guidance,
    string? CheckKind,
    string? OwnerId,
    string? OwnerName,
    string? DueDate,
    string State,
    int RequiredSignOffs,
    bool OwnerMaySign,
    bool HasStaleSignOffs,
    string? LatestVerdict,
    IReadOnlyList<DossierEvidence> Evidence,
    IReadOnlyList<DossierComputation> Computations,
    IReadOnlyList<DossierSignOff> SignOffs,
    string? ConfigurationFingerprint,
    string Fingerprint);
