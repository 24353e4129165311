using EventReview.Data.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests;

/// <summary>The shared data tests over a real SQLite file in a fresh temp folder per test, plus SQLite-only checks.</summary>
public sealed class SqliteDataStoreTests : DataStoreTests
{
    private readonly TempFolder _folder = new("er-sqlite");

    protected override Task<DatabaseSettings> SettingsAsync() => Task.FromResult(DatabaseSettings.ForSqlite(_folder.Path));

    protected override object StoredTime(DateTimeOffset at) => at.UtcTicks;

    public override Task DisposeAsync()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        _folder.Dispose();
        return Task.CompletedTask;
    }

    [Fact]
    public async Task The_database_file_lives_in_the_data_folder_in_wal_mode_next_to_the_attachment_folder()
    {
        await using var db = Factory.CreateDbContext();
        var connection = db.Database.GetDbConnection();
        await connection.OpenAsync();
        await using var cmd = connection.CreateCommand();
        cmd.CommandText = "PRAGMA journal_mode;";

        Assert.Equal("wal", (string?)await cmd.ExecuteScalarAsync());
        Assert.True(File.Exists(Path.Combine(_folder.Path, DatabaseSettings.SqliteFileName)));
        Assert.True(Directory.Exists(Path.Combine(_folder.Path, "attachments")));
    }

    [Fact]
    public async Task The_writer_copies_committed_pages_into_the_database_file_in_the_background()
    {
        var file = Path.Combine(_folder.Path, DatabaseSettings.SqliteFileName);
        await using (var db = Factory.CreateDbContext())
        {
            await db.Database.ExecuteSqlRawAsync("PRAGMA wal_checkpoint(TRUNCATE);");
        }

        var before = new FileInfo(file).Length;
        var gate = new EventReview.Data.Writes.BatchingWriteGate(Factory);
        try
        {
            // Well under the 1,000 pages at which SQLite's own automatic checkpoint would run.
            for (var i = 0; i < 20; i++)
            {
                await using var db = Factory.CreateDbContext();
                db.Cases.Add(SampleCases.Open(NewCandidateId()));
                await gate.SaveAsync(db);
            }

            var waited = System.Diagnostics.Stopwatch.StartNew();
            while (new FileInfo(file).Length == before && waited.Elapsed < TimeSpan.FromSeconds(5))
            {
                await Task.Delay(50);
            }

            Assert.True(new FileInfo(file).Length > before, $"the database file stayed at {before} bytes: nothing was checkpointed");
        }
        finally
        {
            await gate.DisposeAsync();
        }
    }
}
