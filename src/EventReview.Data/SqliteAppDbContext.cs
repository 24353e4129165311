using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>SQLite flavour (the embedded default); migrations in Migrations/Sqlite.</summary>
public sealed class SqliteAppDbContext(DbContextOptions<SqliteAppDbContext> options) : AppDbContext(options)
{
    protected override void ConfigureConventions(ModelConfigurationBuilder configurationBuilder)
    {
        // SQLite has no native date-time-offset type: store exact UTC ticks as a sortable integer (all times are UTC),
        // so that hashed timestamps round-trip exactly.
        configurationBuilder.Properties<DateTimeOffset>().HaveConversion<UtcTicksConverter>();
    }
}
