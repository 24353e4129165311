namespace EventReview.Data.Backup;

/// <summary>
/// The <c>manifest.json</c> of a backup archive: what made it, from what, and the size and SHA-256 of every other
/// entry (in archive order). <see cref="DatabaseFile"/> is null for a PostgreSQL backup, which holds only the
/// attachments (the database itself is dumped with the server's own tools).
/// </summary>
public sealed record BackupManifest(
    string Format,
    DateTimeOffset CreatedUtc,
    string ToolVersion,
    DatabaseProvider Provider,
    string? DatabaseFile,
    BackupCounts Counts,
    IReadOnlyList<BackupManifestEntry> Entries);
