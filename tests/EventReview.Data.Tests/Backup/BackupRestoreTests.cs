using System.IO.Compression;
using System.Text.Json;
using EventReview.Core.Evidence;
using EventReview.Data.Backup;
using EventReview.Data.Tests.Fixtures;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests.Backup;

/// <summary>
/// <see cref="BackupWriter"/> and <see cref="BackupRestorer"/> on a small real data folder (SQLite file in WAL mode
/// and attachment store) holding two worked cases, their attachment and one unreferenced attachment.
/// </summary>
public sealed partial class BackupRestoreTests : IAsyncLifetime
{
    private static readonly byte[] Referenced = "abc"u8.ToArray();
    private static readonly byte[] Unreferenced = "a file nobody points at yet"u8.ToArray();

    private readonly TempFolder _root = new("er-backup");
    private DatabaseSettings _source = default!;

    private string Source => Path.Combine(_root.Path, "data");

    private string Target => Path.Combine(_root.Path, "restored");

    private string Archive => Path.Combine(_root.Path, "backup.zip");

    public async Task InitializeAsync()
    {
        _source = DatabaseSettings.ForSqlite(Source);
        var factory = TestRecords.Factory(_source);
        await DatabaseInitializer.MigrateAsync(factory);
        var store = new AttachmentStore(_source);
        await store.SaveAsync(new MemoryStream(Referenced), 1024);
        await store.SaveAsync(new MemoryStream(Unreferenced), 1024);
        await using var db = factory.CreateDbContext();
        db.Cases.AddRange(SampleCases.Worked("TC-BACKUP-ONE"), SampleCases.Worked("TC-BACKUP-TWO"));
        await db.SaveChangesAsync();
    }

    public Task DisposeAsync()
    {
        SqliteConnection.ClearAllPools();
        _root.Dispose();
        return Task.CompletedTask;
    }

    /// <summary>The source's record key and witness: a backup never holds the key, so the restore is told where it is.</summary>
    private Data.Records.RecordSettings SourceRecords => Data.Records.RecordSettings.ForDataDirectory(Source);

    private Task<RestoreReport> RestoreAsync(RestoreOptions? options = null) =>
        BackupRestorer.RestoreAsync(Archive, DatabaseSettings.ForSqlite(Target), (options ?? new RestoreOptions()) with { Records = SourceRecords });

    private static void RewriteEntry(string zipPath, string name, Func<byte[], byte[]> change)
    {
        using var zip = ZipFile.Open(zipPath, ZipArchiveMode.Update);
        var entry = zip.GetEntry(name)!;
        byte[] bytes;
        using (var s = entry.Open())
        using (var ms = new MemoryStream())
        {
            s.CopyTo(ms);
            bytes = ms.ToArray();
        }

        entry.Delete();
        using var w = zip.CreateEntry(name).Open();
        w.Write(change(bytes));
    }

    private static void AddEntry(string zipPath, string name, byte[] bytes)
    {
        using var zip = ZipFile.Open(zipPath, ZipArchiveMode.Update);
        using var w = zip.CreateEntry(name).Open();
        w.Write(bytes);
    }

    private string[] SiblingsOfTarget() => Directory.EnumerateFileSystemEntries(_root.Path).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray()!;

    [Fact]
    public async Task Entries_witnessed_after_the_backup_are_listed_as_notes_and_entries_witnessed_before_it_must_be_in_it()
    {
        await BackupWriter.CreateAsync(_source, Archive);

        // After the backup: one more note on a case. The witness saw it; the backup cannot have it.
        await using (var db = TestRecords.Factory(_source).CreateDbContext())
        {
            var c = await db.CasesWithEverything().FirstAsync(x => x.CandidateId == "TC-BACKUP-ONE");
            var at = DateTimeOffset.UtcNow;
            c.AddEvidence("beta.one", EventReview.Core.Evidence.EvidenceItem.Note("After the backup.", SampleCases.ReviewerA, at), SampleCases.ReviewerA, at);
            await db.SaveChangesAsync();
        }

        var later = await RestoreAsync();
        Assert.True(later.Valid, string.Join("; ", later.Problems.Select(p => p.What)));
        var note = Assert.Single(later.Notes ?? []);
        Assert.StartsWith("TC-BACKUP-ONE: this backup ends at entry ", note, StringComparison.Ordinal);

        // A head the witness saw before the backup was taken, but which the backup lacks: the backup was truncated.
        var manifestTime = (await BackupArchiveTime()).AddMinutes(-1);
        using (var records = Data.Records.RecordKeeping.Open(SourceRecords))
        using (var witness = new Data.Records.HeadWitness(SourceRecords, records.Keys, new FixedClock(manifestTime)))
        {
            witness.Append([new Data.Records.WitnessedHead("case:TC-BACKUP-TWO", 99, new string('9', 64))]);
            witness.Flush();
        }

        Directory.Delete(Target, recursive: true);
        var truncated = await RestoreAsync();
        Assert.False(truncated.Valid);
        Assert.Contains(truncated.Problems, p => p.Case == "TC-BACKUP-TWO" && p.What.Contains("the newest entries were removed: the witness saw entry 99", StringComparison.Ordinal));
    }

    private async Task<DateTimeOffset> BackupArchiveTime()
    {
        using var zip = ZipFile.OpenRead(Archive);
        await using var m = zip.GetEntry("manifest.json")!.Open();
        using var doc = await System.Text.Json.JsonDocument.ParseAsync(m);
        return doc.RootElement.GetProperty("createdUtc").GetDateTimeOffset();
    }

    [Fact]
    public async Task A_backup_restores_into_an_empty_place_and_the_copy_verifies_with_the_same_cases_and_files()
    {
        var backup = await BackupWriter.CreateAsync(_source, Archive);
        var restored = await RestoreAsync();

        Assert.Equal((2, 2, 3), (backup.CaseCount, backup.AttachmentCount, backup.Files)); // database + 2 attachments
        Assert.True(restored.Valid, string.Join("; ", restored.Problems.Select(p => p.What)));
        Assert.True(restored.Placed);
        Assert.Equal((2, backup.TimelineEntries, 2), (restored.CaseCount, restored.TimelineEntries, restored.AttachmentCount));
        Assert.Null(restored.PreviousFolderMovedTo);
        var store = new AttachmentStore(DatabaseSettings.ForSqlite(Target));
        Assert.True(store.Verify(Hashing.Sha256Hex("abc")));
        Assert.True(store.Verify(Hashing.Sha256Hex(Unreferenced)));
        await using var db = new AppDbContextFactory(DatabaseSettings.ForSqlite(Target)).CreateDbContext();
        Assert.Equal(["TC-BACKUP-ONE", "TC-BACKUP-TWO"], await db.Cases.OrderBy(c => c.CandidateId).Select(c => c.CandidateId).ToListAsync());
        Assert.False(File.Exists(Archive + ".partial"));
        Assert.Equal(["backup.zip", "data", "restored"], SiblingsOfTarget()); // no staging or snapshot folders left behind
    }

    [Fact]
    public async Task The_archive_lists_the_database_then_attachments_by_hash_then_the_manifest_and_the_manifest_hashes_every_entry()
    {
        await BackupWriter.CreateAsync(_source, Archive);

        using var zip = ZipFile.OpenRead(Archive);
        var shas = new[] { Hashing.Sha256Hex("abc"), Hashing.Sha256Hex(Unreferenced) }.Order(StringComparer.Ordinal).ToArray();
        string[] expected = ["database/eventreview.db", $"attachments/{shas[0][..2]}/{shas[0]}", $"attachments/{shas[1][..2]}/{shas[1]}", "manifest.json"];
        Assert.Equal(expected, zip.Entries.Select(e => e.FullName));
        using var m = zip.GetEntry("manifest.json")!.Open();
        var manifest = JsonDocument.Parse(m).RootElement;
        Assert.Equal("eventreview-backup/1", manifest.GetProperty("format").GetString());
        Assert.Equal("Sqlite", manifest.GetProperty("provider").GetString());
        Assert.Equal(1, manifest.GetProperty("counts").GetProperty("referencedAttachments").GetInt32());
        foreach (var e in manifest.GetProperty("entries").EnumerateArray())
        {
            using var s = zip.GetEntry(e.GetProperty("path").GetString()!)!.Open();
            Assert.Equal(e.GetProperty("sha256").GetString(), Hashing.Sha256Hex(s));
        }
    }

    [Fact]
    public async Task A_changed_byte_in_an_attachment_entry_is_refused_naming_the_entry_and_nothing_is_placed()
    {
        await BackupWriter.CreateAsync(_source, Archive);
        var sha = Hashing.Sha256Hex("abc");
        RewriteEntry(Archive, $"attachments/{sha[..2]}/{sha}", _ => "abd"u8.ToArray()); // same length, other content

        var ex = await Assert.ThrowsAsync<BackupException>(() => RestoreAsync());

        Assert.Contains($"Entry attachments/{sha[..2]}/{sha} does not match its SHA-256 in the manifest", ex.Message, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Target));
        Assert.Equal(["backup.zip", "data"], SiblingsOfTarget());
    }

    [Fact]
    public async Task A_changed_byte_in_the_database_entry_is_refused_naming_the_entry()
    {
        await BackupWriter.CreateAsync(_source, Archive);
        RewriteEntry(Archive, "database/eventreview.db", b =>
        {
            b[^1] ^= 0x01;
            return b;
        });

        var ex = await Assert.ThrowsAsync<BackupException>(() => RestoreAsync());

        Assert.Contains("Entry database/eventreview.db does not match its SHA-256", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("../escaped.txt")]
    [InlineData("attachments/../../escaped.txt")]
    [InlineData("/tmp/escaped.txt")]
    [InlineData("attachments\\..\\..\\escaped.txt")]
    [InlineData("C:/escaped.txt")]
    public async Task An_entry_with_an_unsafe_path_is_refused_naming_it_and_nothing_is_written(string name)
    {
        await BackupWriter.CreateAsync(_source, Archive);
        AddEntry(Archive, name, "payload"u8.ToArray());

        var ex = await Assert.ThrowsAsync<BackupException>(() => RestoreAsync());

        Assert.Contains($"Entry '{name}' has an unsafe path", ex.Message, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Target));
        Assert.False(File.Exists(Path.Combine(_root.Path, "escaped.txt")));
        Assert.False(File.Exists(Path.Combine(Path.GetTempPath(), "escaped.txt")) && File.ReadAllText(Path.Combine(Path.GetTempPath(), "escaped.txt")) == "payload");
    }

    [Fact]
    public async Task An_entry_that_the_manifest_does_not_list_is_refused()
    {
        await BackupWriter.CreateAsync(_source, Archive);
        AddEntry(Archive, "attachments/extra.txt", "extra"u8.ToArray());

        var ex = await Assert.ThrowsAsync<BackupException>(() => RestoreAsync());

        Assert.Contains("Entry 'attachments/extra.txt' is not listed in the manifest", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_duplicate_entry_is_refused()
    {
        await BackupWriter.CreateAsync(_source, Archive);
        AddEntry(Archive, "database/eventreview.db", "a second database"u8.ToArray());

        var ex = await Assert.ThrowsAsync<BackupException>(() => RestoreAsync());

        Assert.Contains("Entry 'database/eventreview.db' appears more than once", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_entry_whose_size_disagrees_with_the_manifest_is_refused()
    {
        await BackupWriter.CreateAsync(_source, Archive);
        var sha = Hashing.Sha256Hex(Unreferenced);
        RewriteEntry(Archive, $"attachments/{sha[..2]}/{sha}", b => [.. b, .. "more"u8.ToArray()]);

        var ex = await Assert.ThrowsAsync<BackupException>(() => RestoreAsync());

        Assert.Contains($"Entry attachments/{sha[..2]}/{sha} is {Unreferenced.Length + 4} bytes in the archive but {Unreferenced.Length} in the manifest", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_archive_that_unpacks_beyond_the_size_cap_is_refused_before_anything_is_written()
    {
        await BackupWriter.CreateAsync(_source, Archive);

        var ex = await Assert.ThrowsAsync<BackupException>(() => RestoreAsync(new RestoreOptions(MaxTotalBytes: 1024)));

        Assert.Contains("more than the limit of 1024 bytes", ex.Message, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Target));
    }

    [Fact]
    public async Task A_non_empty_target_is_refused_without_force_and_left_exactly_as_it_was()
    {
        await BackupWriter.CreateAsync(_source, Archive);
        Directory.CreateDirectory(Target);
        await File.WriteAllTextAsync(Path.Combine(Target, "keep.txt"), "mine");

        var ex = await Assert.ThrowsAsync<BackupException>(() => RestoreAsync());

        Assert.Contains($"The target folder {Target} is not empty; give --force", ex.Message, StringComparison.Ordinal);
        Assert.Equal(["keep.txt"], Directory.EnumerateFileSystemEntries(Target).Select(Path.GetFileName));
        Assert.Equal("mine", await File.ReadAllTextAsync(Path.Combine(Target, "keep.txt")));
        Assert.Equal(["backup.zip", "data", "restored"], SiblingsOfTarget());
    }

    [Fact]
    public async Task With_force_a_non_empty_target_is_moved_aside_and_replaced_by_a_verified_copy()
    {
        await BackupWriter.CreateAsync(_source, Archive);
        Directory.CreateDirectory(Target);
        await File.WriteAllTextAsync(Path.Combine(Target, "keep.txt"), "mine");

        var report = await RestoreAsync(new RestoreOptions(Force: true));

        Assert.True(report.Valid);
        Assert.NotNull(report.PreviousFolderMovedTo);
        Assert.Equal("mine", await File.ReadAllTextAsync(Path.Combine(report.PreviousFolderMovedTo!, "keep.txt")));
        Assert.False(File.Exists(Path.Combine(Target, "keep.txt")));
        Assert.True(File.Exists(Path.Combine(Target, "eventreview.db")));
    }
}
