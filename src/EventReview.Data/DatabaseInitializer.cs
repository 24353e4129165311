using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>Creates the data folder, applies migrations and sets SQLite's WAL journal mode.</summary>
public static class DatabaseInitializer
{
    public static async Task MigrateAsync(AppDbContextFactory factory, CancellationToken ct = default)
    {
        Directory.CreateDirectory(factory.Settings.DataDirectory);
        Directory.CreateDirectory(factory.Settings.AttachmentDirectory);
        await using var db = factory.CreateDbContext();
        await db.Database.MigrateAsync(ct);
        if (factory.Settings.Provider == DatabaseProvider.Sqlite)
        {
            await db.Database.ExecuteSqlRawAsync("PRAGMA journal_mode=WAL;", ct);
        }
    }
}
