using System.Diagnostics;
using System.IO.Compression;
using System.Reflection;
using System.Security.Cryptography;
using System.Text.Json;
using Microsoft.Data.Sqlite;

namespace EventReview.Data.Backup;

/// <summary>
/// Writes a backup archive of a data folder while the app may be running (see <see cref="BackupFormat"/> for the layout).
/// Order matters: the database is copied first (one consistent snapshot), then the attachment files. Attachments are
/// immutable and saved before the row that references them commits, so every attachment the snapshot references is
/// already on disk; this is checked, and the backup fails naming any that is missing or altered. Files written after the
/// snapshot may be included; nothing in the snapshot references them. For PostgreSQL only the attachments are archived
/// (dump the database with <c>pg_dump</c> first; the live database's references are checked, a superset of the dump's).
/// The archive is written to <c>FILE.partial</c>, flushed, and renamed at the end.
/// </summary>
public static class BackupWriter
{
    /// <summary>Backs up the data described by <paramref name="settings"/> into <paramref name="outputPath"/>.</summary>
    /// <exception cref="BackupException">When the output exists (without <see cref="BackupOptions.Force"/>), the database is
    /// missing, a referenced attachment is missing, or an attachment file no longer matches its hash.</exception>
    public static async Task<BackupReport> CreateAsync(DatabaseSettings settings, string outputPath, BackupOptions? options = null, CancellationToken ct = default)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentException.ThrowIfNullOrWhiteSpace(outputPath);
        options ??= new BackupOptions();
        var started = Stopwatch.GetTimestamp();
        var output = Path.GetFullPath(outputPath);
        if (Directory.Exists(output))
        {
            throw new BackupException($"The output {output} is a folder; give a file name.");
        }

        if (File.Exists(output) && !options.Force)
        {
            throw new BackupException($"The output file {output} already exists; give --force to replace it.");
        }

        Directory.CreateDirectory(Path.GetDirectoryName(output)!);
        var partial = output + ".partial";
        var work = $"{output}.snapshot-{Guid.NewGuid():N}";
        try
        {
            Directory.CreateDirectory(work);
            // The backup's time is taken before the snapshot: every entry witnessed before it is in the snapshot.
            var created = options.Clock.GetUtcNow();
            string? snapshot = null;
            var factsFrom = settings;
            if (settings.Provider == DatabaseProvider.Sqlite)
            {
                snapshot = Path.Combine(work, DatabaseSettings.SqliteFileName);
                SqliteSnapshot.Copy(new SqliteConnectionStringBuilder(settings.ConnectionString).DataSource, snapshot);
                factsFrom = new DatabaseSettings(DatabaseProvider.Sqlite, $"Data Source={snapshot};Pooling=False", work);
            }

            var facts = await SnapshotFacts.ReadAsync(new AppDbContextFactory(factsFrom), ct);
            var files = AttachmentFiles.List(settings.AttachmentDirectory);
            var onDisk = files.Select(f => f.Sha256).ToHashSet(StringComparer.Ordinal);
            var missing = facts.ReferencedAttachments.Where(s => !onDisk.Contains(s)).Order(StringComparer.Ordinal).ToList();
            if (missing.Count > 0)
            {
                throw new BackupException($"{missing.Count} attachment(s) referenced by the database are missing from {settings.AttachmentDirectory}: "
                    + string.Join(", ", missing.Take(5)) + (missing.Count > 5 ? ", ..." : string.Empty));
            }

            var entries = new List<BackupManifestEntry>();
            await using (var stream = new FileStream(partial, FileMode.Create, FileAccess.Write, FileShare.None, 81920, FileOptions.Asynchronous))
            {
                using (var zip = new ZipArchive(stream, ZipArchiveMode.Create, leaveOpen: true))
                {
                    if (snapshot is not null)
                    {
                        entries.Add(await AddFileAsync(zip, BackupFormat.DatabasePath, snapshot, CompressionLevel.Optimal, created, ct));
                    }

                    foreach (var (sha, path) in files)
                    {
                        var entry = await AddFileAsync(zip, BackupFormat.AttachmentEntry(sha), path, CompressionLevel.Fastest, created, ct);
                        if (entry.Sha256 != sha)
                        {
                            var referenced = facts.ReferencedAttachments.Contains(sha) ? "referenced by the database " : string.Empty;
                            throw new BackupException($"The attachment {sha} {referenced}no longer matches its hash on disk (it was altered); run verify.");
                        }

                        entries.Add(entry);
                    }

                    var counts = new BackupCounts(facts.Cases, facts.TimelineEntries, facts.EvidenceItems, facts.ReferencedAttachments.Count, files.Count);
                    var manifest = new BackupManifest(BackupFormat.Name, created, ToolVersion(), settings.Provider,
                        snapshot is null ? null : DatabaseSettings.SqliteFileName, counts, entries);
                    var manifestEntry = zip.CreateEntry(BackupFormat.ManifestPath, CompressionLevel.Optimal);
                    manifestEntry.LastWriteTime = created;
                    await using var m = manifestEntry.Open();
                    await JsonSerializer.SerializeAsync(m, manifest, BackupFormat.Json, ct);
                }

                await stream.FlushAsync(ct);
                stream.Flush(flushToDisk: true);
            }

            File.Move(partial, output, overwrite: options.Force);
            var note = settings.Provider == DatabaseProvider.Postgres
                ? "Only the attachments were archived: the PostgreSQL database must be dumped with pg_dump -Fc, before this backup (see docs/operations-backup.md)."
                : null;
            return new BackupReport(output, settings.Provider, entries.Count, entries.Sum(e => e.SizeBytes), new FileInfo(output).Length,
                files.Count, facts.Cases, facts.TimelineEntries, Stopwatch.GetElapsedTime(started).TotalSeconds, note);
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            if (File.Exists(partial))
            {
                File.Delete(partial);
            }

            if (Directory.Exists(work))
            {
                Directory.Delete(work, recursive: true);
            }
        }
    }

    /// <summary>Copies a file into a new entry, hashing it on the way.</summary>
    private static async Task<BackupManifestEntry> AddFileAsync(ZipArchive zip, string entryName, string path, CompressionLevel level, DateTimeOffset at, CancellationToken ct)
    {
        var entry = zip.CreateEntry(entryName, level);
        entry.LastWriteTime = at;
        using var sha = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        long length = 0;
        try
        {
            await using var source = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 81920, FileOptions.Asynchronous | FileOptions.SequentialScan);
            await using var target = entry.Open();
            var buffer = new byte[81920];
            int read;
            while ((read = await source.ReadAsync(buffer, ct)) > 0)
            {
                sha.AppendData(buffer, 0, read);
                await target.WriteAsync(buffer.AsMemory(0, read), ct);
                length += read;
            }
        }
        catch (FileNotFoundException ex)
        {
            throw new BackupException($"The file {path} disappeared while it was being backed up; attachments must never be deleted.", ex);
        }

        return new BackupManifestEntry(entryName, length, Convert.ToHexStringLower(sha.GetHashAndReset()));
    }

    private static string ToolVersion()
    {
        var assembly = typeof(BackupWriter).Assembly;
        return assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion
            ?? assembly.GetName().Version?.ToString() ?? "unknown";
    }
}
