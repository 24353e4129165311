namespace EventReview.Data.Backup;

/// <summary>
/// What the backed-up database held at the moment of the snapshot: cases, timeline entries, evidence rows, distinct
/// attachments referenced by evidence, and attachment files in the archive (which may include files written after the
/// snapshot that nothing references yet).
/// </summary>
public sealed record BackupCounts(int Cases, int TimelineEntries, int EvidenceItems, int ReferencedAttachments, int AttachmentFiles);
