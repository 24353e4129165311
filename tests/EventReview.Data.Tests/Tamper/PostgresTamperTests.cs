using EventReview.Data.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests.Tamper;

/// <summary>The tamper suite on PostgreSQL (the intruder connects to the server and drops the triggers), one fresh database per test.</summary>
[Collection(PostgresCollection.Name)]
public sealed class PostgresTamperTests(PostgresServer server) : TamperTests
{
    protected override async Task<DatabaseSettings> SettingsAsync(string folder) =>
        new(DatabaseProvider.Postgres, await server.DatabaseAsync("tamper_" + Guid.NewGuid().ToString("N")[..12]), folder);

    protected override object Stored(DateTimeOffset at) => at.ToUniversalTime();

    protected override async Task DropGuardsAsync(AppDbContext db)
    {
        var triggers = await db.Database.SqlQueryRaw<string>(
            "SELECT format('DROP TRIGGER %I ON %I', t.tgname, c.relname) AS \"Value\" FROM pg_trigger t JOIN pg_class c ON c.oid = t.tgrelid WHERE t.tgname LIKE 'er_%' AND NOT t.tgisinternal").ToListAsync();
        foreach (var drop in triggers)
        {
#pragma warning disable EF1002 // statements built by the server from its own catalogue
            await db.Database.ExecuteSqlRawAsync(drop);
#pragma warning restore EF1002
        }
    }
}
