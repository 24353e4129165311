namespace EventReview.Data.Backup;

/// <summary>
/// Options of <see cref="BackupRestorer"/>. <see cref="Force"/> replaces a non-empty target folder (the old folder is
/// moved aside, never deleted). <see cref="AllowInvalid"/> places a restored copy even when its integrity verification
/// finds problems (for investigation; the problems are still reported). <see cref="MaxTotalBytes"/> caps the unpacked
/// size of the archive (default 256 GiB) and <see cref="MaxEntries"/> its number of entries, so that a hostile archive
/// cannot fill the disk. <see cref="Records"/> names the record key folder and the witness the restored copy is
/// verified against (null: <c>keys/</c> and <c>witness/</c> in the target folder); backups never hold the private key.
/// </summary>
public sealed record RestoreOptions(bool Force = false, bool AllowInvalid = false, long MaxTotalBytes = 256L * 1024 * 1024 * 1024, int MaxEntries = 5_000_000,
    Records.RecordSettings? Records = null)
{
    /// <summary>The clock that names a folder moved aside (tests give their own).</summary>
    public TimeProvider Clock { get; init; } = TimeProvider.System;
}
