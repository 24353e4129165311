using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Network;
using EventReview.Data.Auth;
using Microsoft.AspNetCore.Identity.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>
/// The EventReview database. Provider-specific subclasses (<see cref="SqliteAppDbContext"/>,
/// <see cref="PostgresAppDbContext"/>) carry their own migration sets. Add a migration to both:
/// <code>
/// dotnet ef migrations add NAME --project src/EventReview.Data --context SqliteAppDbContext --output-dir Migrations/Sqlite
/// dotnet ef migrations add NAME --project src/EventReview.Data --context PostgresAppDbContext --output-dir Migrations/Postgres
/// </code>
/// </summary>
public abstract class AppDbContext(DbContextOptions options) : IdentityDbContext<AppUser>(options)
{
    public DbSet<ReviewCase> Cases => Set<ReviewCase>();

    public DbSet<ChecklistItem> Items => Set<ChecklistItem>();

    public DbSet<EvidenceItem> Evidence => Set<EvidenceItem>();

    public DbSet<ComputationRecord> Computations => Set<ComputationRecord>();

    public DbSet<SignOff> SignOffs => Set<SignOff>();

    public DbSet<ActivityEntry> Activity => Set<ActivityEntry>();

    public DbSet<DetectorNetwork> Networks => Set<DetectorNetwork>();

    public DbSet<Site> Sites => Set<Site>();

    public DbSet<ApiToken> ApiTokens => Set<ApiToken>();

    /// <summary>The sign-in audit (append-only, hash-chained).</summary>
    public DbSet<AccountEvent> AccountEvents => Set<AccountEvent>();

    public DbSet<Core.Dossier.DossierExportRecord> DossierExports => Set<Core.Dossier.DossierExportRecord>();

    public DbSet<Core.Configuration.ConfigurationSnapshot> ConfigurationSnapshots => Set<Core.Configuration.ConfigurationSnapshot>();

    public DbSet<Core.Injections.SealedInjectionRecord> SealedInjectionRecords => Set<Core.Injections.SealedInjectionRecord>();

    /// <summary>Loads a whole case aggregate (arrivals, items with evidence, computations, sign-offs, timeline).</summary>
    public IQueryable<ReviewCase> CasesWithEverything() => Cases
        .Include(c => c.Arrivals)
        .Include(c => c.Activity)
        .Include(c => c.Items).ThenInclude(i => i.Evidence)
        .Include(c => c.Items).ThenInclude(i => i.Computations)
        .Include(c => c.Items).ThenInclude(i => i.SignOffs)
        .AsSplitQuery();

    protected override void OnModelCreating(ModelBuilder builder)
    {
        base.OnModelCreating(builder);
        builder.ApplyConfigurationsFromAssembly(typeof(AppDbContext).Assembly);
    }
}
