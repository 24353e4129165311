using System.Text.Json;
using EventReview.Cli.Commands;
using EventReview.Data;
using Microsoft.Data.Sqlite;

namespace EventReview.Cli.Tests.Commands;

/// <summary><c>eventreview backup</c> and <c>eventreview restore</c> on a real data folder holding the sample case.</summary>
[Collection("Console")]
public sealed class BackupCommandTests : IAsyncLifetime
{
    private readonly string _root = Path.Combine(Path.GetTempPath(), "er-cli-backup-" + Guid.NewGuid().ToString("N"));

    private string Data => Path.Combine(_root, "data");

    private string Zip => Path.Combine(_root, "backup.zip");

    private string Restored => Path.Combine(_root, "restored");

    /// <summary>The source's record key and witness: a backup holds neither, so restoring elsewhere is told where they are.</summary>
    private string KeyFolder => Path.Combine(Data, "keys");

    private string WitnessFolder => Path.Combine(Data, "witness");

    public async Task InitializeAsync()
    {
        var settings = DatabaseSettings.ForSqlite(Data);
        var factory = new AppDbContextFactory(settings, CliRecords.For(Data));
        await DatabaseInitializer.MigrateAsync(factory);
        await new AttachmentStore(settings).SaveAsync(new MemoryStream(SampleCase.AttachmentBytes), 1024);
        await using var db = factory.CreateDbContext();
        db.Cases.Add(SampleCase.Build(freezeInTimeline: false).Case);
        await db.SaveChangesAsync();
    }

    public Task DisposeAsync()
    {
        SqliteConnection.ClearAllPools();
        try
        {
            Directory.Delete(_root, recursive: true);
        }
        catch (IOException)
        {
        }

        return Task.CompletedTask;
    }

    private static JsonElement Json(string output) => JsonDocument.Parse(output).RootElement;

    [Fact]
    public void Backup_then_restore_exit_0_and_report_counts_and_a_valid_verification_in_json()
    {
        var (backupCode, backupOut, backupErr) = CliRunner.Run(BackupCommand.Build(), "backup", "--data", Data, "--out", Zip, "--json");
        var (restoreCode, restoreOut, restoreErr) = CliRunner.Run(RestoreCommand.Build(), "restore", "--in", Zip, "--data", Restored, "--keys", KeyFolder, "--witness", WitnessFolder, "--json");

        Assert.True(backupCode == 0, backupErr);
        var backup = Json(backupOut);
        Assert.Equal((1, 1, 2), (backup.GetProperty("caseCount").GetInt32(), backup.GetProperty("attachmentCount").GetInt32(), backup.GetProperty("files").GetInt32()));
        Assert.Equal("Sqlite", backup.GetProperty("provider").GetString());
        Assert.Equal(Zip, backup.GetProperty("outputPath").GetString());
        Assert.True(restoreCode == 0, restoreErr);
        var restore = Json(restoreOut);
        Assert.True(restore.GetProperty("valid").GetBoolean());
        Assert.True(restore.GetProperty("placed").GetBoolean());
        Assert.Equal(0, restore.GetProperty("problems").GetArrayLength());
        Assert.Equal(1, restore.GetProperty("caseCount").GetInt32());

        var (verifyCode, verifyOut, _) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", Restored, "--keys", KeyFolder, "--witness", WitnessFolder);
        Assert.Equal(0, verifyCode);
        Assert.StartsWith("valid (1 case(s)", verifyOut.Trim().Split('\n')[^1], StringComparison.Ordinal);
    }

    [Fact]
    public void Text_output_names_what_was_backed_up_and_restored()
    {
        var (backupCode, backupOut, _) = CliRunner.Run(BackupCommand.Build(), "backup", "--data", Data, "--out", Zip);
        var (restoreCode, restoreOut, _) = CliRunner.Run(RestoreCommand.Build(), "restore", "--in", Zip, "--data", Restored, "--keys", KeyFolder, "--witness", WitnessFolder);

        Assert.Equal((0, 0), (backupCode, restoreCode));
        Assert.StartsWith("backed up 1 case(s), ", backupOut, StringComparison.Ordinal);
        Assert.Contains($"to {Zip} in ", backupOut, StringComparison.Ordinal);
        Assert.StartsWith("restored 1 case(s), ", restoreOut, StringComparison.Ordinal);
        Assert.Contains($"into {Restored}; verification: valid", restoreOut, StringComparison.Ordinal);
    }

    [Fact]
    public void Backup_over_an_existing_file_exits_2_without_force_and_0_with_it()
    {
        File.WriteAllText(Zip, "older");

        var (code, _, error) = CliRunner.Run(BackupCommand.Build(), "backup", "--data", Data, "--out", Zip);
        var (forced, _, _) = CliRunner.Run(BackupCommand.Build(), "backup", "--data", Data, "--out", Zip, "--force");

        Assert.Equal(2, code);
        Assert.StartsWith("error: The output file ", error, StringComparison.Ordinal);
        Assert.Contains("already exists; give --force", error, StringComparison.Ordinal);
        Assert.Equal(0, forced);
        Assert.NotEqual("older", File.ReadAllText(Zip));
    }

    [Fact]
    public void Restore_into_a_non_empty_folder_exits_2_naming_it_and_force_moves_it_aside()
    {
        CliRunner.Run(BackupCommand.Build(), "backup", "--data", Data, "--out", Zip);

        var (code, _, error) = CliRunner.Run(RestoreCommand.Build(), "restore", "--in", Zip, "--data", Data);
        var (forced, output, forcedErr) = CliRunner.Run(RestoreCommand.Build(), "restore", "--in", Zip, "--data", Data, "--force");

        Assert.Equal(2, code);
        Assert.Contains($"The target folder {Data} is not empty; give --force", error, StringComparison.Ordinal);
        Assert.True(forced == 0, forcedErr);
        Assert.Contains($"the previous folder was moved to {Data}.before-restore-", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Restore_of_a_missing_or_foreign_file_exits_2_with_a_one_line_error()
    {
        var notZip = Path.Combine(_root, "notes.txt");
        File.WriteAllText(notZip, "not an archive");

        var (missing, _, missingErr) = CliRunner.Run(RestoreCommand.Build(), "restore", "--in", Path.Combine(_root, "none.zip"), "--data", Restored, "--keys", KeyFolder, "--witness", WitnessFolder);
        var (foreign, _, foreignErr) = CliRunner.Run(RestoreCommand.Build(), "restore", "--in", notZip, "--data", Restored, "--keys", KeyFolder, "--witness", WitnessFolder);

        Assert.Equal((2, 2), (missing, foreign));
        Assert.Contains("There is no backup file at", missingErr, StringComparison.Ordinal);
        Assert.Contains("is not a readable ZIP archive", foreignErr, StringComparison.Ordinal);
        Assert.Single(foreignErr.TrimEnd().Split('\n'));
        Assert.False(Directory.Exists(Restored));
    }

    [Fact]
    public void A_restored_copy_that_fails_verification_exits_1_listing_the_problem_and_is_not_placed()
    {
        using (var connection = new SqliteConnection($"Data Source={Path.Combine(Data, "eventreview.db")};Pooling=False"))
        {
            connection.Open();
            using var cmd = connection.CreateCommand();
            cmd.CommandText = "DROP TRIGGER er_Timeline_no_update; UPDATE \"Timeline\" SET \"ActorName\" = 'Somebody Else' WHERE \"Sequence\" = 2;";
            cmd.ExecuteNonQuery();
        }

        CliRunner.Run(BackupCommand.Build(), "backup", "--data", Data, "--out", Zip);
        var (code, output, _) = CliRunner.Run(RestoreCommand.Build(), "restore", "--in", Zip, "--data", Restored, "--keys", KeyFolder, "--witness", WitnessFolder);

        Assert.Equal(1, code);
        Assert.Contains(" entry 2: Timeline: Entry 2 (", output, StringComparison.Ordinal);
        Assert.Contains($"verification FAILED: 1 problem(s) listed above; nothing was placed in {Restored}", output, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Restored));
    }

    [Fact]
    public void Restore_of_a_sqlite_archive_into_postgres_is_refused()
    {
        CliRunner.Run(BackupCommand.Build(), "backup", "--data", Data, "--out", Zip);

        var (code, _, error) = CliRunner.Run(RestoreCommand.Build(), "restore", "--in", Zip, "--data", Restored, "--keys", KeyFolder, "--witness", WitnessFolder, "--provider", "Postgres", "--connection", "Host=127.0.0.1;Database=none");

        Assert.Equal(2, code);
        Assert.Contains("This archive holds a SQLite database", error, StringComparison.Ordinal);
    }
}
