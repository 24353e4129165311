using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests.Tamper;

/// <summary>The tamper suite on the SQLite file (the intruder edits the file with its triggers dropped).</summary>
public sealed class SqliteTamperTests : TamperTests
{
    protected override Task<DatabaseSettings> SettingsAsync(string folder) => Task.FromResult(DatabaseSettings.ForSqlite(folder));

    protected override object Stored(DateTimeOffset at) => at.UtcTicks;

    protected override async Task DropGuardsAsync(AppDbContext db)
    {
        var names = await db.Database.SqlQueryRaw<string>("SELECT name AS \"Value\" FROM sqlite_master WHERE type = 'trigger' AND name LIKE 'er_%'").ToListAsync();
        foreach (var name in names)
        {
#pragma warning disable EF1002 // trigger names read from the schema
            await db.Database.ExecuteSqlRawAsync($"DROP TRIGGER \"{name}\"");
#pragma warning restore EF1002
        }
    }
}
