namespace EventReview.Data.Backup;

/// <summary>Options of <see cref="BackupWriter"/>: <see cref="Force"/> replaces an existing output file.</summary>
public sealed record BackupOptions(bool Force = false)
{
    /// <summary>The clock of the backup's creation time (tests give their own).</summary>
    public TimeProvider Clock { get; init; } = TimeProvider.System;
}
