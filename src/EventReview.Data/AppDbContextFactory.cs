using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>
/// Creates the provider's context for each unit of work (Blazor components use one per operation). The options are
/// built once: they are immutable, and building them per context costs every request a little. With
/// <see cref="Records.RecordKeeping"/> every context signs the chain entries it saves and reports their heads to the witness.
/// </summary>
public sealed class AppDbContextFactory : IDbContextFactory<AppDbContext>
{
    private readonly DbContextOptions<PostgresAppDbContext>? _postgres;
    private readonly DbContextOptions<SqliteAppDbContext>? _sqlite;

    public AppDbContextFactory(DatabaseSettings settings, Records.RecordKeeping? records = null)
    {
        Settings = settings;
        Records = records;
        var interceptors = records is null ? [] : new Microsoft.EntityFrameworkCore.Diagnostics.IInterceptor[] { new Records.RecordSigningInterceptor(records) };
        if (settings.Provider == DatabaseProvider.Postgres)
        {
            _postgres = new DbContextOptionsBuilder<PostgresAppDbContext>().UseNpgsql(settings.ConnectionString).AddInterceptors(interceptors).Options;
        }
        else
        {
            _sqlite = new DbContextOptionsBuilder<SqliteAppDbContext>().UseSqlite(settings.ConnectionString).AddInterceptors(interceptors).Options;
        }
    }

    public DatabaseSettings Settings { get; }

    /// <summary>The record keys and witness every save uses, or null (nothing is signed: the record will not verify).</summary>
    public Records.RecordKeeping? Records { get; }

    public AppDbContext CreateDbContext() => _postgres is not null
        ? new PostgresAppDbContext(_postgres)
        : new SqliteAppDbContext(_sqlite!);
}
