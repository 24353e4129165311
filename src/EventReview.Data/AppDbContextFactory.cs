using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>
/// Creates the provider's context for each unit of work (Blazor components use one per operation). The options are
/// built once: they are immutable, and building them per context costs every request a little.
/// </summary>
public sealed class AppDbContextFactory : IDbContextFactory<AppDbContext>
{
    private readonly DbContextOptions<PostgresAppDbContext>? _postgres;
    private readonly DbContextOptions<SqliteAppDbContext>? _sqlite;

    public AppDbContextFactory(DatabaseSettings settings)
    {
        Settings = settings;
        if (settings.Provider == DatabaseProvider.Postgres)
        {
            _postgres = new DbContextOptionsBuilder<PostgresAppDbContext>().UseNpgsql(settings.ConnectionString).Options;
        }
        else
        {
            _sqlite = new DbContextOptionsBuilder<SqliteAppDbContext>().UseSqlite(settings.ConnectionString).Options;
        }
    }

    public DatabaseSettings Settings { get; }

    public AppDbContext CreateDbContext() => _postgres is not null
        ? new PostgresAppDbContext(_postgres)
        : new SqliteAppDbContext(_sqlite!);
}
