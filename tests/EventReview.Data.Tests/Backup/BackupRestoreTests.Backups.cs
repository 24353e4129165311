using System.IO.Compression;
using System.Text.Json;
using EventReview.Core.Evidence;
using EventReview.Data.Backup;
using EventReview.Data.Tests.Fixtures;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests.Backup;

/// <summary>Backups of a store that is missing, altered or tampered with, and existing outputs.</summary>
public sealed partial class BackupRestoreTests
{
    [Fact]
    public async Task A_missing_referenced_attachment_fails_the_backup_naming_its_hash_and_leaves_no_file()
    {
        var sha = Hashing.Sha256Hex("abc");
        File.Delete(new AttachmentStore(_source).PathFor(sha));

        var ex = await Assert.ThrowsAsync<BackupException>(() => BackupWriter.CreateAsync(_source, Archive));

        Assert.Contains($"1 attachment(s) referenced by the database are missing from {_source.AttachmentDirectory}: {sha}", ex.Message, StringComparison.Ordinal);
        Assert.False(File.Exists(Archive));
        Assert.False(File.Exists(Archive + ".partial"));
        Assert.Equal(["data"], SiblingsOfTarget());
    }

    [Fact]
    public async Task An_altered_attachment_on_disk_fails_the_backup_naming_it()
    {
        var sha = Hashing.Sha256Hex("abc");
        await File.WriteAllTextAsync(new AttachmentStore(_source).PathFor(sha), "abd");

        var ex = await Assert.ThrowsAsync<BackupException>(() => BackupWriter.CreateAsync(_source, Archive));

        Assert.Contains($"The attachment {sha} referenced by the database no longer matches its hash on disk", ex.Message, StringComparison.Ordinal);
        Assert.False(File.Exists(Archive));
    }

    [Fact]
    public async Task An_existing_output_is_refused_without_force_and_replaced_with_it()
    {
        await File.WriteAllTextAsync(Archive, "older");

        var ex = await Assert.ThrowsAsync<BackupException>(() => BackupWriter.CreateAsync(_source, Archive));
        Assert.Contains("already exists; give --force", ex.Message, StringComparison.Ordinal);
        Assert.Equal("older", await File.ReadAllTextAsync(Archive));

        var report = await BackupWriter.CreateAsync(_source, Archive, new BackupOptions(Force: true));
        Assert.Equal(new FileInfo(Archive).Length, report.ArchiveBytes);
        Assert.True((await RestoreAsync()).Valid);
    }

    [Fact]
    public async Task A_backup_of_a_tampered_database_restores_as_invalid_naming_the_case_and_is_not_placed()
    {
        await using (var db = TestRecords.Factory(_source).CreateDbContext())
        {
            await db.Database.ExecuteSqlRawAsync("DROP TRIGGER er_Evidence_no_update;");
            await db.Database.ExecuteSqlRawAsync("UPDATE \"Evidence\" SET \"Text\" = 'Forged.' WHERE \"Text\" = 'Two.' AND \"ChecklistItemId\" IN "
                + "(SELECT i.\"Id\" FROM \"ChecklistItems\" i JOIN \"Cases\" c ON c.\"Id\" = i.\"ReviewCaseId\" WHERE c.\"CandidateId\" = 'TC-BACKUP-TWO')");
        }

        await BackupWriter.CreateAsync(_source, Archive);
        var report = await RestoreAsync();

        Assert.False(report.Valid);
        Assert.False(report.Placed);
        Assert.NotEmpty(report.Problems);
        Assert.All(report.Problems, p => Assert.Equal(("TC-BACKUP-TWO", "alpha.two"), (p.Case, p.Item)));
        Assert.False(Directory.Exists(Target));

        var kept = await RestoreAsync(new RestoreOptions(AllowInvalid: true));
        Assert.True(kept.Placed);
        Assert.True(File.Exists(Path.Combine(Target, "eventreview.db")));
    }
}
