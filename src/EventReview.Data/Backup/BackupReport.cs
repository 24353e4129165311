using System.Text.Json.Serialization;

namespace EventReview.Data.Backup;

/// <summary>
/// What a backup wrote: the archive path, files archived (database and attachments, not the manifest) and their
/// bytes, the archive's own size, counts from the snapshot, how long it took, and a note for the operator (for PostgreSQL: the database must be dumped separately).
/// </summary>
public sealed record BackupReport(
    string OutputPath,
    [property: JsonConverter(typeof(JsonStringEnumConverter<DatabaseProvider>))] DatabaseProvider Provider,
    int Files,
    long Bytes,
    long ArchiveBytes,
    int AttachmentCount,
    int CaseCount,
    int TimelineEntries,
    double DurationSeconds,
    string? Note);
