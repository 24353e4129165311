using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Network;
using EventReview.Data.Auth;
using Microsoft.AspNetCore.DataProtection.EntityFrameworkCore;
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
public abstract class AppDbContext(DbContextOptions options) : IdentityDbContext<AppUser>(options), IDataProtectionKeyContext
{
    /// <summary>
    /// The ASP.NET Core data-protection key ring (cookie, antiforgery and sign-in state keys), shared by every app
    /// instance on this database so that a cookie made by one is read by another.
    /// </summary>
    public DbSet<DataProtectionKey> DataProtectionKeys => Set<DataProtectionKey>();

    /// <summary>Sign-offs waiting for their signer to re-authenticate at the identity provider.</summary>
    public DbSet<SignatureRequest> SignatureRequests => Set<SignatureRequest>();

    /// <summary>Each person's notification choices.</summary>
    public DbSet<Notifications.NotificationSettings> NotificationSettings => Set<Notifications.NotificationSettings>();

    /// <summary>What each person is to be told.</summary>
    public DbSet<Notifications.Notification> Notifications => Set<Notifications.Notification>();

    /// <summary>E-mails and webhook requests to send, being retried, sent or given up.</summary>
    public DbSet<Notifications.OutboxMessage> OutboxMessages => Set<Notifications.OutboxMessage>();

    /// <summary>How far the notification worker has read the timeline.</summary>
    public DbSet<Notifications.NotificationCursor> NotificationCursors => Set<Notifications.NotificationCursor>();

    public DbSet<ReviewCase> Cases => Set<ReviewCase>();

    public DbSet<ChecklistItem> Items => Set<ChecklistItem>();

    public DbSet<EvidenceItem> Evidence => Set<EvidenceItem>();

    public DbSet<ComputationRecord> Computations => Set<ComputationRecord>();

    public DbSet<SignOff> SignOffs => Set<SignOff>();

    public DbSet<TimelineEntry> Timeline => Set<TimelineEntry>();

    public DbSet<DetectorNetwork> Networks => Set<DetectorNetwork>();

    public DbSet<Site> Sites => Set<Site>();

    public DbSet<ApiToken> ApiTokens => Set<ApiToken>();

    /// <summary>The sign-in audit (append-only, hash-chained).</summary>
    public DbSet<AccountEvent> AccountEvents => Set<AccountEvent>();

    public DbSet<Core.Dossier.DossierExportRecord> DossierExports => Set<Core.Dossier.DossierExportRecord>();

    public DbSet<Core.Configuration.ConfigurationSnapshot> ConfigurationSnapshots => Set<Core.Configuration.ConfigurationSnapshot>();

    public DbSet<Core.Injections.SealedInjectionRecord> SealedInjectionRecords => Set<Core.Injections.SealedInjectionRecord>();

    /// <summary>Heads of the chain entries the save in progress writes (see <see cref="Records.RecordSigningInterceptor"/>).</summary>
    internal List<Records.WitnessedHead> SavingHeads { get; } = [];

    /// <summary>Heads written by saves of this context that are not witnessed yet (they wait for a commit).</summary>
    internal List<Records.WitnessedHead> PendingHeads { get; } = [];

    /// <summary>Takes the heads this context wrote since the last call, for the witness once their transaction committed.</summary>
    public IReadOnlyList<Records.WitnessedHead> TakeWitnessHeads()
    {
        var heads = PendingHeads.ToList();
        PendingHeads.Clear();
        return heads;
    }

    /// <summary>Loads a whole case aggregate (arrivals, items with evidence, computations, sign-offs, timeline).</summary>
    public IQueryable<ReviewCase> CasesWithEverything() => Cases
        .Include(c => c.Arrivals)
        .Include(c => c.Timeline)
        .Include(c => c.Items).ThenInclude(i => i.Evidence)
        .Include(c => c.Items).ThenInclude(i => i.Computations)
        .Include(c => c.Items).ThenInclude(i => i.SignOffs)
        .AsSplitQuery();

    /// <summary>
    /// Loads (tracked) a case with only one checklist item (its evidence, computations and sign-offs) and only its newest
    /// timeline entry: enough to append evidence to that item and extend the chain, at a cost that does not grow with the
    /// case or the database. Each part is one indexed query. Domain methods that look at other items need <see cref="CasesWithEverything"/>.
    /// </summary>
    /// <returns>The case, or null when there is none with that id.</returns>
    public async Task<ReviewCase?> LoadCaseWithOneItemAsync(int caseId, string itemKey, CancellationToken ct = default)
    {
        var c = await Cases.FirstOrDefaultAsync(x => x.Id == caseId, ct);
        if (c is null)
        {
            return null;
        }

        await Items.Where(i => i.ReviewCaseId == caseId && i.Key == itemKey)
            .Include(i => i.Evidence).Include(i => i.Computations).Include(i => i.SignOffs)
            .AsSplitQuery().LoadAsync(ct);
        await Timeline.Where(a => a.ReviewCaseId == caseId).OrderByDescending(a => a.Sequence).Take(1).LoadAsync(ct);
        return c;
    }

    protected override void OnModelCreating(ModelBuilder builder)
    {
        base.OnModelCreating(builder);
        builder.ApplyConfigurationsFromAssembly(typeof(AppDbContext).Assembly);
    }
}
