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

    /// <summary>Notes an export of case <paramref name="reviewCaseId"/>: manifest SHA-256, timeline head covered, ZIP size in bytes, who and when.</summary>
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

    /// <summary>Database key of the note.</summary>
    public int Id { get; private set; }

    /// <summary>Database key of the exported case.</summary>
    public int ReviewCaseId { get; private set; }

    /// <summary>Lowercase hex SHA-256 of manifest.json in the exported ZIP.</summary>
    public string ManifestSha256 { get; private set; }

    /// <summary>Hash of the newest timeline entry covered by the export.</summary>
    public string ChainHead { get; private set; }

    /// <summary>Size of the exported ZIP file, bytes.</summary>
    public long SizeBytes { get; private set; }

    /// <summary>User id of whoever exported the dossier.</summary>
    public string ExportedBy { get; private set; }

    /// <summary>Printed name of whoever exported the dossier, as it was then.</summary>
    public string ExportedByName { get; private set; }

    /// <summary>When the dossier was exported (UTC; the export service stores it to whole milliseconds).</summary>
    public DateTimeOffset ExportedAt { get; private set; }
}
