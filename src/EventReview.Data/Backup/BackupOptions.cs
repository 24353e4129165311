namespace EventReview.Data.Backup;

/// <summary>Options of <see cref="BackupWriter"/>: <see cref="Force"/> replaces an existing output file.</summary>
public sealed record BackupOptions(bool Force = false);
