using System.IO.Compression;
using System.Security.Cryptography;
using System.Text.Json;

namespace EventReview.Data.Backup;

/// <summary>
/// A backup archive opened for restoring, checked before anything is unpacked: every entry name is a safe relative
/// path (no <c>..</c>, no absolute or drive paths, no backslashes), appears once, is listed in the manifest with the
/// same size, and the manifest lists nothing that is absent; the declared sizes stay under the caps. Entries are then
/// unpacked one by one with their SHA-256 checked before the file gets its final name.
/// </summary>
internal sealed class BackupArchive : IDisposable
{
    private const long MaxManifestBytes = 256L * 1024 * 1024;

    private readonly ZipArchive _zip;
    private readonly Dictionary<string, ZipArchiveEntry> _entries;

    private BackupArchive(ZipArchive zip, Dictionary<string, ZipArchiveEntry> entries, BackupManifest manifest)
    {
        _zip = zip;
        _entries = entries;
        Manifest = manifest;
    }

    public BackupManifest Manifest { get; }

    public long TotalBytes => Manifest.Entries.Sum(e => e.SizeBytes);

    /// <summary>Opens and checks the archive (see the class remarks).</summary>
    /// <exception cref="BackupException">Naming the first entry or manifest field found wrong.</exception>
    public static BackupArchive Open(string path, RestoreOptions options)
    {
        if (!File.Exists(path))
        {
            throw new BackupException($"There is no backup file at {path}.");
        }

        ZipArchive zip;
        try
        {
            zip = ZipFile.OpenRead(path);
        }
        catch (InvalidDataException ex)
        {
            throw new BackupException($"{path} is not a readable ZIP archive: {ex.Message}", ex);
        }

        try
        {
            var entries = IndexEntries(zip, options);
            var manifest = ReadManifest(entries);
            CheckAgainstManifest(entries, manifest, options);
            return new BackupArchive(zip, entries, manifest);
        }
        catch
        {
            zip.Dispose();
            throw;
        }
    }

    /// <summary>
    /// Unpacks one manifest entry to <paramref name="destination"/>: written to a temp name beside it, its size and
    /// SHA-256 compared with the manifest, and only then renamed into place.
    /// </summary>
    public async Task ExtractAsync(BackupManifestEntry expected, string destination, CancellationToken ct)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(destination)!);
        var temp = destination + ".unverified";
        try
        {
            using var sha = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
            long length = 0;
            await using (var source = _entries[expected.Path].Open())
            await using (var target = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None, 81920, FileOptions.Asynchronous))
            {
                var buffer = new byte[81920];
                int read;
                while ((read = await source.ReadAsync(buffer, ct)) > 0)
                {
                    length += read;
                    if (length > expected.SizeBytes)
                    {
                        // The ZIP's own size field lied: stop before a crafted entry can fill the disk.
                        throw new BackupException($"Entry {expected.Path} unpacks to more than the {expected.SizeBytes} bytes its manifest states.");
                    }

                    sha.AppendData(buffer, 0, read);
                    await target.WriteAsync(buffer.AsMemory(0, read), ct);
                }

                await target.FlushAsync(ct);
                target.Flush(flushToDisk: true);
            }

            if (length != expected.SizeBytes)
            {
                throw new BackupException($"Entry {expected.Path} unpacks to {length} bytes but its manifest states {expected.SizeBytes}.");
            }

            var actual = Convert.ToHexStringLower(sha.GetHashAndReset());
            if (actual != expected.Sha256)
            {
                throw new BackupException($"Entry {expected.Path} does not match its SHA-256 in the manifest (the archive was altered or damaged).");
            }

            File.Move(temp, destination);
        }
        catch (InvalidDataException ex)
        {
            throw new BackupException($"Entry {expected.Path} cannot be unpacked: {ex.Message}", ex);
        }
        finally
        {
            if (File.Exists(temp))
            {
                File.Delete(temp);
            }
        }
    }

    public void Dispose() => _zip.Dispose();

    private static Dictionary<string, ZipArchiveEntry> IndexEntries(ZipArchive zip, RestoreOptions options)
    {
        if (zip.Entries.Count > options.MaxEntries + 1)
        {
            throw new BackupException($"The archive has {zip.Entries.Count} entries, more than the limit of {options.MaxEntries}.");
        }

        var entries = new Dictionary<string, ZipArchiveEntry>(StringComparer.Ordinal);
        foreach (var e in zip.Entries)
        {
            if (!IsSafeName(e.FullName))
            {
                throw new BackupException($"Entry '{e.FullName}' has an unsafe path (absolute, '..', backslash or empty part); the archive is refused.");
            }

            if (!entries.TryAdd(e.FullName, e))
            {
                throw new BackupException($"Entry '{e.FullName}' appears more than once; the archive is refused.");
            }
        }

        return entries;
    }

    private static BackupManifest ReadManifest(Dictionary<string, ZipArchiveEntry> entries)
    {
        if (!entries.TryGetValue(BackupFormat.ManifestPath, out var entry))
        {
            throw new BackupException($"The archive has no {BackupFormat.ManifestPath}; it is not an EventReview backup.");
        }

        if (entry.Length > MaxManifestBytes)
        {
            throw new BackupException($"{BackupFormat.ManifestPath} is {entry.Length} bytes, more than the limit of {MaxManifestBytes}.");
        }

        BackupManifest? manifest;
        try
        {
            using var bounded = new MemoryStream();
            using (var s = entry.Open())
            {
                var buffer = new byte[81920];
                int read;
                while ((read = s.Read(buffer)) > 0)
                {
                    if (bounded.Length + read > MaxManifestBytes)
                    {
                        throw new BackupException($"{BackupFormat.ManifestPath} unpacks to more than {MaxManifestBytes} bytes.");
                    }

                    bounded.Write(buffer, 0, read);
                }
            }

            bounded.Position = 0;
            manifest = JsonSerializer.Deserialize<BackupManifest>(bounded, BackupFormat.Json);
        }
        catch (Exception ex) when (ex is JsonException or InvalidDataException or NotSupportedException)
        {
            throw new BackupException($"{BackupFormat.ManifestPath} cannot be read: {ex.Message}", ex);
        }

        if (manifest is null || manifest.Format != BackupFormat.Name)
        {
            throw new BackupException($"{BackupFormat.ManifestPath} is not of format {BackupFormat.Name} (found '{manifest?.Format}').");
        }

        if (manifest.Entries is null || manifest.Counts is null)
        {
            throw new BackupException($"{BackupFormat.ManifestPath} has no entry list or counts.");
        }

        return manifest;
    }

    private static void CheckAgainstManifest(Dictionary<string, ZipArchiveEntry> entries, BackupManifest manifest, RestoreOptions options)
    {
        var listed = new HashSet<string>(StringComparer.Ordinal);
        long total = 0;
        foreach (var m in manifest.Entries)
        {
            if (m?.Path is null || m.Sha256 is null || !listed.Add(m.Path))
            {
                throw new BackupException($"{BackupFormat.ManifestPath} lists entry '{m?.Path}' twice or without a hash.");
            }

            var isDatabase = m.Path == BackupFormat.DatabasePath && manifest.Provider == DatabaseProvider.Sqlite;
            var attachmentSha = BackupFormat.ShaOfAttachmentEntry(m.Path);
            if (!isDatabase && attachmentSha is null)
            {
                throw new BackupException($"{BackupFormat.ManifestPath} lists '{m.Path}', which is not a database or attachment path of this format.");
            }

            if (attachmentSha is not null && m.Sha256 != attachmentSha)
            {
                throw new BackupException($"{BackupFormat.ManifestPath} gives attachment {m.Path} a SHA-256 other than its name.");
            }

            if (!Core.Evidence.Hashing.IsSha256Hex(m.Sha256) || m.SizeBytes < 0)
            {
                throw new BackupException($"{BackupFormat.ManifestPath} gives entry {m.Path} an invalid size or SHA-256.");
            }

            if (!entries.TryGetValue(m.Path, out var zipEntry))
            {
                throw new BackupException($"Entry {m.Path} is listed in the manifest but missing from the archive.");
            }

            if (zipEntry.Length != m.SizeBytes)
            {
                throw new BackupException($"Entry {m.Path} is {zipEntry.Length} bytes in the archive but {m.SizeBytes} in the manifest.");
            }

            total += m.SizeBytes;
            if (total > options.MaxTotalBytes)
            {
                throw new BackupException($"The archive unpacks to more than the limit of {options.MaxTotalBytes} bytes; the archive is refused.");
            }
        }

        var stray = entries.Keys.Where(k => k != BackupFormat.ManifestPath && !listed.Contains(k)).Order(StringComparer.Ordinal).FirstOrDefault();
        if (stray is not null)
        {
            throw new BackupException($"Entry '{stray}' is not listed in the manifest; the archive is refused.");
        }

        if (manifest.Provider == DatabaseProvider.Sqlite && !listed.Contains(BackupFormat.DatabasePath))
        {
            throw new BackupException($"The archive is a SQLite backup without {BackupFormat.DatabasePath}.");
        }
    }

    /// <summary>A relative path of non-empty parts separated by '/', none of them '.' or '..', with no drive, backslash or control character.</summary>
    internal static bool IsSafeName(string name) =>
        name.Length is > 0 and < 1024
        && !name.StartsWith('/')
        && !name.Contains('\\', StringComparison.Ordinal)
        && !name.Contains(':', StringComparison.Ordinal)
        && !name.Any(char.IsControl)
        && name.Split('/').All(part => part.Length > 0 && part != "." && part != "..");
}
