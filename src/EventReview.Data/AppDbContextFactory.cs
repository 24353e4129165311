using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>Creates the provider's context for each unit of work (Blazor components use one per operation).</summary>
public sealed class AppDbContextFactory(DatabaseSettings settings) : IDbContextFactory<AppDbContext>
{
    public DatabaseSettings Settings { get; } = settings;

    public AppDbContext CreateDbContext() => Settings.Provider switch
    {
        DatabaseProvider.Postgres => new PostgresAppDbContext(new DbContextOptionsBuilder<PostgresAppDbContext>()
            .UseNpgsql(Settings.ConnectionString).Options),
        _ => new SqliteAppDbContext(new DbContextOptionsBuilder<SqliteAppDbContext>()
            .UseSqlite(Settings.ConnectionString).Options),
    };
}
