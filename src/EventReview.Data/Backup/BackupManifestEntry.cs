namespace EventReview.Data.Backup;

/// <summary>One archive entry: its path inside the archive (forward slashes), size in bytes and SHA-256 (lowercase hex).</summary>
public sealed record BackupManifestEntry(string Path, long SizeBytes, string Sha256);
