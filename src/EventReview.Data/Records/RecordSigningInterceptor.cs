using EventReview.Core.Cases;
using EventReview.Data.Auth;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Diagnostics;

namespace EventReview.Data.Records;

/// <summary>
/// Signs every timeline and sign-in audit entry a save adds, just before it is written, and keeps the chain heads it
/// wrote on the context. When the save committed by itself (no transaction open) the heads go to the witness at once;
/// inside a transaction that EF Core began they go when it commits; inside a write batch the write gate sends them after
/// the batch's commit (<see cref="AppDbContext.TakeWitnessHeads"/>).
/// </summary>
public sealed class RecordSigningInterceptor(RecordKeeping records) : SaveChangesInterceptor, IDbTransactionInterceptor
{
    public override InterceptionResult<int> SavingChanges(DbContextEventData eventData, InterceptionResult<int> result)
    {
        Sign(eventData.Context);
        return result;
    }

    public override ValueTask<InterceptionResult<int>> SavingChangesAsync(DbContextEventData eventData, InterceptionResult<int> result, CancellationToken cancellationToken = default)
    {
        Sign(eventData.Context);
        return ValueTask.FromResult(result);
    }

    public override int SavedChanges(SaveChangesCompletedEventData eventData, int result)
    {
        Saved(eventData.Context);
        return result;
    }

    public override ValueTask<int> SavedChangesAsync(SaveChangesCompletedEventData eventData, int result, CancellationToken cancellationToken = default)
    {
        Saved(eventData.Context);
        return ValueTask.FromResult(result);
    }

    public override void SaveChangesFailed(DbContextErrorEventData eventData) => Failed(eventData.Context);

    public override Task SaveChangesFailedAsync(DbContextErrorEventData eventData, CancellationToken cancellationToken = default)
    {
        Failed(eventData.Context);
        return Task.CompletedTask;
    }

    /// <summary>
    /// Signs the new entries without a change scan of its own (the save runs one next): new timeline entries are the
    /// unsaved ones (id 0) in the activity lists of the tracked cases (or added directly); audit entries are added directly.
    /// </summary>
    private void Sign(DbContext? context)
    {
        if (context is not AppDbContext db)
        {
            return;
        }

        var detect = db.ChangeTracker.AutoDetectChangesEnabled;
        db.ChangeTracker.AutoDetectChangesEnabled = false;
        try
        {
            var signed = new HashSet<TimelineEntry>(ReferenceEqualityComparer.Instance);
            foreach (var c in db.ChangeTracker.Entries<ReviewCase>())
            {
                foreach (var a in c.Entity.Timeline.Where(a => a.Id == 0 && signed.Add(a)))
                {
                    db.SavingHeads.Add(records.Sign(a));
                }
            }

            foreach (var e in db.ChangeTracker.Entries<TimelineEntry>().Where(e => e.State == EntityState.Added && signed.Add(e.Entity)))
            {
                db.SavingHeads.Add(records.Sign(e.Entity));
            }

            foreach (var e in db.ChangeTracker.Entries<AccountEvent>().Where(e => e.State == EntityState.Added))
            {
                db.SavingHeads.Add(records.Sign(e.Entity));
            }
        }
        finally
        {
            db.ChangeTracker.AutoDetectChangesEnabled = detect;
        }
    }

    private void Saved(DbContext? context)
    {
        if (context is not AppDbContext db)
        {
            return;
        }

        db.PendingHeads.AddRange(db.SavingHeads);
        db.SavingHeads.Clear();
        if (db.Database.CurrentTransaction is null)
        {
            records.Committed(db.TakeWitnessHeads());
        }
    }

    private static void Failed(DbContext? context)
    {
        if (context is AppDbContext db)
        {
            db.SavingHeads.Clear();
        }
    }

    // Transactions begun through EF Core: the heads of their saves are witnessed once they commit.
    public void TransactionCommitted(System.Data.Common.DbTransaction transaction, TransactionEndEventData eventData) => Committed(eventData.Context);

    public Task TransactionCommittedAsync(System.Data.Common.DbTransaction transaction, TransactionEndEventData eventData, CancellationToken cancellationToken = default)
    {
        Committed(eventData.Context);
        return Task.CompletedTask;
    }

    public void TransactionRolledBack(System.Data.Common.DbTransaction transaction, TransactionEndEventData eventData) => RolledBack(eventData.Context);

    public Task TransactionRolledBackAsync(System.Data.Common.DbTransaction transaction, TransactionEndEventData eventData, CancellationToken cancellationToken = default)
    {
        RolledBack(eventData.Context);
        return Task.CompletedTask;
    }

    private void Committed(DbContext? context)
    {
        if (context is AppDbContext db)
        {
            records.Committed(db.TakeWitnessHeads());
        }
    }

    private static void RolledBack(DbContext? context)
    {
        if (context is AppDbContext db)
        {
            db.TakeWitnessHeads();
        }
    }
}
