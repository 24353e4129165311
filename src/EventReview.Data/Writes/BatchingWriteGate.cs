using System.Data.Common;
using System.Threading.Channels;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Storage;

namespace EventReview.Data.Writes;

/// <summary>
/// The single writer of an embedded (SQLite) database, with group commit. SQLite lets one connection write at a time
/// and its driver answers a locked database by sleeping and retrying, so writers queue here instead. Callers read and
/// change on their own contexts in parallel; one loop takes every waiting save (up to <see cref="MaxBatch"/>), runs
/// each on its one connection inside one transaction (each save in its own savepoint, so a failing save is undone
/// alone and its caller gets the error), and commits once: one flush to disk serves the whole batch. Every caller's
/// task completes only after the commit, so nothing is acknowledged before it is durable; if the commit fails, every
/// save of the batch fails with that error and nothing of it is stored.
/// </summary>
public sealed class BatchingWriteGate : IWriteGate, IAsyncDisposable
{
    /// <summary>Most saves committed together.</summary>
    public const int MaxBatch = 64;

    private readonly AppDbContextFactory _factory;
    private readonly Channel<PendingSave> _queue = Channel.CreateUnbounded<PendingSave>(new UnboundedChannelOptions { SingleReader = true });
    private readonly Task _loop;

    public BatchingWriteGate(AppDbContextFactory factory)
    {
        _factory = factory;
        _loop = Task.Run(LoopAsync);
    }

    public Task SaveAsync(AppDbContext db, CancellationToken ct = default)
    {
        ct.ThrowIfCancellationRequested();
        var save = new PendingSave(db, ct);
        if (!_queue.Writer.TryWrite(save))
        {
            throw new ObjectDisposedException(nameof(BatchingWriteGate), "The application is shutting down; nothing was stored.");
        }

        return save.Done.Task;
    }

    public async ValueTask DisposeAsync()
    {
        _queue.Writer.TryComplete();
        await _loop;
    }

    private async Task LoopAsync()
    {
        var batch = new List<PendingSave>(MaxBatch);
        while (await _queue.Reader.WaitToReadAsync())
        {
            batch.Clear();
            while (batch.Count < MaxBatch && _queue.Reader.TryRead(out var save))
            {
                if (save.Cancelled.IsCancellationRequested)
                {
                    save.Done.TrySetCanceled(save.Cancelled);
                }
                else
                {
                    batch.Add(save);
                }
            }

            if (batch.Count > 0)
            {
                await RunBatchAsync(batch);
            }
        }
    }

    private async Task RunBatchAsync(List<PendingSave> batch)
    {
        var saved = new List<PendingSave>(batch.Count);
        try
        {
            await using var writer = _factory.CreateDbContext();
            var connection = writer.Database.GetDbConnection();
            await writer.Database.OpenConnectionAsync();
            await using var tx = await connection.BeginTransactionAsync();
            foreach (var save in batch)
            {
                try
                {
                    // The caller's context saves through the writer's connection and transaction; EF Core wraps the save
                    // in a savepoint of that transaction and rolls back to it if the save fails.
                    Enlist(save.Db, connection, tx);
                    await save.Db.SaveChangesAsync(save.Cancelled);
                    saved.Add(save);
                }
                catch (Exception ex)
                {
                    save.Done.TrySetException(ex);
                }
                finally
                {
                    save.Db.Database.UseTransaction(null);
                }
            }

            await tx.CommitAsync();
        }
        catch (Exception ex)
        {
            // The transaction (or opening it) failed: nothing of this batch is stored.
            foreach (var save in batch)
            {
                save.Done.TrySetException(ex);
            }

            return;
        }

        foreach (var save in saved)
        {
            save.Done.TrySetResult();
        }
    }

    private static void Enlist(AppDbContext db, DbConnection connection, DbTransaction tx)
    {
        if (!ReferenceEquals(db.Database.GetDbConnection(), connection))
        {
            db.Database.CloseConnection();
            db.Database.SetDbConnection(connection, contextOwnsConnection: false);
        }

        db.Database.UseTransaction(tx);
    }

    private sealed class PendingSave(AppDbContext db, CancellationToken cancelled)
    {
        public AppDbContext Db { get; } = db;

        public CancellationToken Cancelled { get; } = cancelled;

        public TaskCompletionSource Done { get; } = new(TaskCreationOptions.RunContinuationsAsynchronously);
    }
}
