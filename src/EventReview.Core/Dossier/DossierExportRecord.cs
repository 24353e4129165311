namespace EventReview.Core.Dossier;

/// <summary>
/// A note that a dossier was exported: when, by whom, the manifest's SHA-256 and the timeline head it covered. Kept
/// outside the case's timeline so that exporting does not change the case (two exports of an unchanged case are identical).
/// </summary>
public sealed class DossierExportRecord
{
    private DossierExportRecord()
    {
        ManifestSha256 = string.Empty;
        ChainHead = string.Empty;
        ExportedBy = string.Empty;
        ExportedByName = string.Empty;
    }

    public DossierExportRecord(int reviewCaseId, string manifestSha256, string chainHead, long sizeBytes, Cases.Actor by, DateTimeOffset at)
    {
        ReviewCaseId = reviewCaseId;
        ManifestSha256 = manifestSha256;
        ChainHead = chainHead;
        SizeBytes = sizeBytes;
        ExportedBy = by.UserId;
        ExportedByName = by.DisplayName;
        ExportedAt = at;
    }

    public int Id { get; private set; }

    public int ReviewCaseId { get; private set; }

    /// <summary>Lowercase hex SHA-256 of manifest.json in the exported ZIP.</summary>
    public string ManifestSha256 { get; private set; }

    /// <summary>Hash of the newest timeline entry covered by the export.</summary>
    public string ChainHead { get; private set; }

    public long SizeBytes { get; private set; }

    public string ExportedBy { get; private set; }

    public string ExportedByName { get; private set; }

    public DateTimeOffset ExportedAt { get; private set; }
}
