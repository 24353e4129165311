using System.Diagnostics;
using System.Globalization;
using EventReview.Core.Cases;
using Microsoft.Data.Sqlite;

namespace EventReview.Data.Backup;

/// <summary>
/// Restores a backup archive into a data folder. The archive is checked first (<see cref="BackupArchive"/>), then
/// unpacked into a fresh staging folder beside the target with every entry's SHA-256 checked before it is placed, then
/// the restored database is opened (SQLite: migrated as the app would on start) and the whole record verified with
/// <see cref="IntegrityVerifier"/>. Only a copy that verifies clean is moved into place (unless
/// <see cref="RestoreOptions.AllowInvalid"/>), so a failed restore never leaves a half-written data folder. A non-empty
/// target is refused unless <see cref="RestoreOptions.Force"/>; then it is moved aside to
/// <c>DIR.before-restore-yyyyMMddTHHmmssZ</c>, never deleted. The copy is verified with the record keys and against the
/// witness (<see cref="RestoreOptions.Records"/>; a backup older than the witness reports the entries it lacks); a key
/// folder or witness kept inside the old data folder is copied into the restored one.
/// For a PostgreSQL archive (attachments only), <paramref name="target"/> must name the database already restored with
/// <c>pg_restore</c>; the attachments go into the target folder and that database is verified against them.
/// </summary>
public static class BackupRestorer
{
    /// <summary>Restores <paramref name="archivePath"/> into <paramref name="target"/>'s data folder.</summary>
    /// <exception cref="BackupException">When the archive is refused, the target is not empty (without force), or the
    /// provider of the archive and of the target disagree. A restored copy that fails verification is reported, not thrown.</exception>
    public static async Task<RestoreReport> RestoreAsync(string archivePath, DatabaseSettings target, RestoreOptions? options = null, CancellationToken ct = default)
    {
        ArgumentNullException.ThrowIfNull(target);
        ArgumentException.ThrowIfNullOrWhiteSpace(archivePath);
        options ??= new RestoreOptions();
        var started = Stopwatch.GetTimestamp();
        var folder = Path.GetFullPath(target.DataDirectory).TrimEnd(Path.DirectorySeparatorChar);
        using var archive = BackupArchive.Open(Path.GetFullPath(archivePath), options);
        var manifest = archive.Manifest;
        CheckProviders(manifest.Provider, target.Provider);
        if (File.Exists(folder))
        {
            throw new BackupException($"The target {folder} is a file, not a folder.");
        }

        var nonEmpty = Directory.Exists(folder) && Directory.EnumerateFileSystemEntries(folder).Any();
        if (nonEmpty && !options.Force)
        {
            throw new BackupException($"The target folder {folder} is not empty; give --force to replace it (the old folder is moved aside, not deleted).");
        }

        var parent = Path.GetDirectoryName(folder) ?? throw new BackupException($"The target {folder} has no parent folder.");
        Directory.CreateDirectory(parent);
        CheckFreeSpace(parent, archive.TotalBytes);
        var staging = Path.Combine(parent, $".{Path.GetFileName(folder)}.restore-{Guid.NewGuid():N}");
        try
        {
            Directory.CreateDirectory(staging);
            var stagingSettings = target.Provider == DatabaseProvider.Sqlite
                ? new DatabaseSettings(DatabaseProvider.Sqlite, $"Data Source={Path.Combine(staging, DatabaseSettings.SqliteFileName)};Pooling=False", staging)
                : target with { DataDirectory = staging };
            foreach (var entry in manifest.Entries)
            {
                var relative = entry.Path == BackupFormat.DatabasePath ? DatabaseSettings.SqliteFileName : entry.Path;
                await archive.ExtractAsync(entry, Path.Combine(staging, relative.Replace('/', Path.DirectorySeparatorChar)), ct);
            }

            Directory.CreateDirectory(stagingSettings.AttachmentDirectory);
            var records = options.Records ?? Records.RecordSettings.ForDataDirectory(folder);
            // A SQLite archive was taken at a known moment: every entry witnessed before it must be in it. A PostgreSQL
            // dump was taken separately, at a time this archive does not know: newer witnessed entries are only listed.
            var witnessedBefore = manifest.Provider == DatabaseProvider.Sqlite ? manifest.CreatedUtc : DateTimeOffset.MinValue;
            var (problems, cases, entries, notes) = await VerifyAsync(stagingSettings, records, witnessedBefore, ct);
            var valid = problems.Count == 0;
            string? movedAside = null;
            var placed = valid || options.AllowInvalid;
            if (placed)
            {
                CarryOver(records.KeyDirectory, folder, staging);
                CarryOver(records.WitnessDirectory, folder, staging);
                movedAside = Swap(staging, folder, nonEmpty, options.Clock);
            }

            var attachments = manifest.Entries.Count(e => e.Path.StartsWith(BackupFormat.AttachmentPrefix, StringComparison.Ordinal));
            return new RestoreReport(folder, manifest.Provider, manifest.CreatedUtc, manifest.Entries.Count, archive.TotalBytes, attachments,
                cases, entries, Stopwatch.GetElapsedTime(started).TotalSeconds, valid, placed, problems, movedAside, notes);
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            if (Directory.Exists(staging))
            {
                Directory.Delete(staging, recursive: true);
            }
        }
    }

    private static void CheckProviders(DatabaseProvider archive, DatabaseProvider target)
    {
        if (archive == DatabaseProvider.Postgres && target != DatabaseProvider.Postgres)
        {
            throw new BackupException("This archive comes from a PostgreSQL installation and holds only the attachments: restore the database with "
                + "pg_restore first, then run restore with --provider Postgres --connection pointing at it (see docs/operations-backup.md).");
        }

        if (archive == DatabaseProvider.Sqlite && target != DatabaseProvider.Sqlite)
        {
            throw new BackupException("This archive holds a SQLite database; restore it into a data folder (--data DIR) without --provider Postgres.");
        }
    }

    private static void CheckFreeSpace(string parent, long needed)
    {
        var free = new DriveInfo(Path.GetPathRoot(parent)!).AvailableFreeSpace;
        try
        {
            free = new DriveInfo(parent).AvailableFreeSpace;
        }
        catch (ArgumentException)
        {
            // Not a mount point on this system; the root's figure stands.
        }

        if (needed > free)
        {
            throw new BackupException($"The archive unpacks to {needed} bytes but only {free} bytes are free under {parent}.");
        }
    }

    /// <summary>Copies a key folder or witness that lives inside the old data folder into the same place in the restored copy.</summary>
    private static void CarryOver(string path, string folder, string staging)
    {
        var full = Path.GetFullPath(path);
        var prefix = folder + Path.DirectorySeparatorChar;
        if (!full.StartsWith(prefix, StringComparison.Ordinal) || !Directory.Exists(full))
        {
            return;
        }

        var target = Path.Combine(staging, full[prefix.Length..]);
        foreach (var file in Directory.EnumerateFiles(full, "*", SearchOption.AllDirectories))
        {
            var to = Path.Combine(target, Path.GetRelativePath(full, file));
            Records.FileRecordKeyRing.CreatePrivateFolder(Path.GetDirectoryName(to)!);
            File.Copy(file, to, overwrite: false);
            if (!OperatingSystem.IsWindows())
            {
                File.SetUnixFileMode(to, File.GetUnixFileMode(file));
            }
        }
    }

    private static async Task<(IReadOnlyList<IntegrityProblem> Problems, int Cases, int Entries, IReadOnlyList<string> Notes)> VerifyAsync(
        DatabaseSettings settings, Records.RecordSettings records, DateTimeOffset backupTime, CancellationToken ct)
    {
        using var keeping = Records.RecordKeeping.Open(records);
        var factory = new AppDbContextFactory(settings, keeping);
        if (settings.Provider == DatabaseProvider.Sqlite)
        {
            // As the app does on start: bring the schema up to date and use WAL.
            await DatabaseInitializer.MigrateAsync(factory, ct);
        }

        var (cases, database) = await new IntegrityVerifier(factory, new AttachmentStore(settings), settings, keeping).VerifyAsync(null, backupTime, ct);

        // Entries witnessed after the backup was taken are not in it: said plainly, not counted as problems.
        var newest = keeping.Witness.Read().Newest;
        var notes = cases.Select(c => newest.TryGetValue(Core.Records.EntryMac.CaseChain(c.CandidateId), out var w) && w.Head.Sequence > c.Entries
                ? $"{c.CandidateId}: this backup ends at entry {c.Entries}; the witness saw entries up to {w.Head.Sequence} (last on {w.At}), which are not in it."
                : null)
            .OfType<string>().ToList();
        return (database.Concat(cases.SelectMany(c => c.Problems)).ToList(), cases.Count, cases.Sum(c => c.Entries), notes);
    }

    /// <summary>Moves the verified staging folder to the target; a non-empty target is moved aside first (and back on failure).</summary>
    private static string? Swap(string staging, string folder, bool nonEmpty, TimeProvider clock)
    {
        if (!Directory.Exists(folder))
        {
            Directory.Move(staging, folder);
            return null;
        }

        if (!nonEmpty)
        {
            Directory.Delete(folder);
            Directory.Move(staging, folder);
            return null;
        }

        var aside = $"{folder}.before-restore-{clock.GetUtcNow().UtcDateTime.ToString("yyyyMMdd'T'HHmmss'Z'", CultureInfo.InvariantCulture)}";
        aside = Directory.Exists(aside) ? $"{aside}-{Guid.NewGuid().ToString("N")[..8]}" : aside;
        Directory.Move(folder, aside);
        try
        {
            Directory.Move(staging, folder);
        }
        catch
        {
            Directory.Move(aside, folder);
            throw;
        }

        return aside;
    }
}
