using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>PostgreSQL flavour (team server); migrations in Migrations/Postgres.</summary>
public sealed class PostgresAppDbContext(DbContextOptions<PostgresAppDbContext> options) : AppDbContext(options);
