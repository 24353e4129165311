using System.Data.Common;
using System.Diagnostics;
using System.Diagnostics.Metrics;
using System.Threading.Channels;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Storage;

namespace EventReview.Data.Writes;

/// <summary>The units of work the writer runs: a caller's EF save, a hand-written SQL unit, and a unit run on a fresh context.</summary>
public sealed partial class BatchingWriteGate
{
    private abstract class PendingUnit(CancellationToken cancelled)
    {
        public CancellationToken Cancelled { get; } = cancelled;

        public long Queued { get; } = Stopwatch.GetTimestamp();

        /// <summary>Times the unit was chosen to break a lock cycle (see <see cref="IsLockConflict"/>).</summary>
        public int Attempts { get; set; }

        /// <summary>
        /// True when the unit can run again after its savepoint was rolled back: work run on a fresh context or on plain
        /// SQL can; a caller's own context (<see cref="PendingSave"/>) cannot, as its tracked state is the caller's.
        /// </summary>
        public virtual bool CanRetry => true;

        /// <summary>Heads of the chain entries the unit wrote (valid once it executed without error).</summary>
        public List<Records.WitnessedHead> Heads { get; } = [];

        public abstract Task ExecuteAsync(DbConnection connection, DbTransaction tx);

        public abstract void Complete();

        public abstract void Fail(Exception ex);

        public abstract void Cancel();
    }

    private sealed class PendingSave(AppDbContext db, ChainHeadCache? heads, CancellationToken cancelled) : PendingUnit(cancelled)
    {
        public TaskCompletionSource Done { get; } = new(TaskCreationOptions.RunContinuationsAsynchronously);

        public override bool CanRetry => false;

        public override async Task ExecuteAsync(DbConnection connection, DbTransaction tx)
        {
            try
            {
                Enlist(db, connection, tx);
                await db.SaveChangesAsync(Cancelled);
                Heads.AddRange(db.TakeWitnessHeads());
                heads?.ForgetChains(Heads);
            }
            finally
            {
                db.Database.UseTransaction(null);
            }
        }

        public override void Complete() => Done.TrySetResult();

        public override void Fail(Exception ex) => Done.TrySetException(ex);

        public override void Cancel() => Done.TrySetCanceled(Cancelled);
    }

    private sealed class PendingSql<T>(BatchingWriteGate gate, Func<SqlUnit, CancellationToken, Task<T>> work, CancellationToken cancelled) : PendingUnit(cancelled)
    {
        private T? _value;

        public TaskCompletionSource<T> Result { get; } = new(TaskCreationOptions.RunContinuationsAsynchronously);

        public override async Task ExecuteAsync(DbConnection connection, DbTransaction tx)
        {
            // Statements stay prepared on SQLite's one connection; on PostgreSQL the driver prepares on its own.
            var provider = gate._factory.Settings.Provider;
            Heads.Clear();
            if (provider == DatabaseProvider.Postgres)
            {
                await ExecuteOnServerAsync(connection, tx);
                return;
            }

            using var unit = new SqlUnit(provider, connection, tx, gate._prepared, gate._factory.Records);
            await unit.Command("SAVEPOINT eventreview_sql").ExecuteNonQueryAsync(Cancelled);
            try
            {
                _value = await work(unit, Cancelled);
                await unit.Command("RELEASE eventreview_sql").ExecuteNonQueryAsync(Cancelled);
                Heads.AddRange(unit.Heads);
            }
            catch
            {
                // Undo whatever the work stored before it failed, keeping the rest of the batch.
                await unit.Command("ROLLBACK TO eventreview_sql").ExecuteNonQueryAsync(CancellationToken.None);
                await unit.Command("RELEASE eventreview_sql").ExecuteNonQueryAsync(CancellationToken.None);
                throw;
            }
        }

        /// <summary>
        /// On PostgreSQL the unit's savepoint goes with its first statements and its release with its last (see
        /// <see cref="SqlUnit.BatchAsync"/>), saving two round trips; what is still open is released or undone here.
        /// </summary>
        private async Task ExecuteOnServerAsync(DbConnection connection, DbTransaction tx)
        {
            using var unit = new SqlUnit(DatabaseProvider.Postgres, connection, tx, null, gate._factory.Records, gate._heads, deferSavepoint: true) { Pipe = gate._pipe };
            try
            {
                _value = await work(unit, Cancelled);
                if (unit.Savepoint == SqlUnit.SavepointState.Open)
                {
                    await unit.Command($"RELEASE {SqlUnit.SavepointName}").ExecuteNonQueryAsync(Cancelled);
                }

                Heads.AddRange(unit.Heads);
            }
            catch (Exception ex) when (ex is not BatchAbortException)
            {
                switch (unit.Savepoint)
                {
                    case SqlUnit.SavepointState.Open:
                        // Undo whatever the work stored before it failed, keeping the rest of the batch.
                        await unit.Command($"ROLLBACK TO {SqlUnit.SavepointName}; RELEASE {SqlUnit.SavepointName}").ExecuteNonQueryAsync(CancellationToken.None);
                        throw;
                    case SqlUnit.SavepointState.Released:
                        // The work is part of the transaction and cannot be taken out alone.
                        throw new BatchAbortException($"A write failed after its changes joined the batch ({ex.Message}); the whole batch is undone.");
                    default:
                        throw;
                }
            }
        }

        public override void Complete() => Result.TrySetResult(_value!);

        public override void Fail(Exception ex) => Result.TrySetException(ex);

        public override void Cancel() => Result.TrySetCanceled(Cancelled);
    }

    private sealed class PendingRun<T>(AppDbContextFactory factory, ChainHeadCache? heads, Func<AppDbContext, CancellationToken, Task<T>> work, CancellationToken cancelled) : PendingUnit(cancelled)
    {
        private T? _value;

        public TaskCompletionSource<T> Result { get; } = new(TaskCreationOptions.RunContinuationsAsynchronously);

        public override async Task ExecuteAsync(DbConnection connection, DbTransaction tx)
        {
            Heads.Clear();
            await using var db = factory.CreateDbContext();
            Enlist(db, connection, tx);
            var savepoint = "eventreview_run";
            await tx.SaveAsync(savepoint, Cancelled);
            try
            {
                _value = await work(db, Cancelled);
                await tx.ReleaseAsync(savepoint, Cancelled);
                Heads.AddRange(db.TakeWitnessHeads());
                heads?.ForgetChains(Heads);
            }
            catch
            {
                // The work may have failed after a save: undo everything it did.
                await tx.RollbackAsync(savepoint, CancellationToken.None);
                throw;
            }
        }

        public override void Complete() => Result.TrySetResult(_value!);

        public override void Fail(Exception ex) => Result.TrySetException(ex);

        public override void Cancel() => Result.TrySetCanceled(Cancelled);
    }
}
