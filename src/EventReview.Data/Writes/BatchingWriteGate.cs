using System.Threading.Channels;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Storage;

namespace EventReview.Data.Writes;

/// <summary>
/// The single writer of an embedded (SQLite) database, with group commit. SQLite lets one connection write at a time
/// and its driver answers a locked database by sleeping and retrying, so concurrent writers queue here instead: one
/// loop takes every waiting unit of work (up to <see cref="MaxBatch"/>), runs each inside its own savepoint of one
/// transaction, and commits once, so that one flush to disk serves the whole batch. A unit that fails is rolled back
/// to its savepoint alone and its caller gets the exception; the others are unaffected. Every caller's task completes
/// only after the commit, so nothing is acknowledged before it is durable; if the commit itself fails, every unit of
/// the batch fails with that error and nothing of it is stored.
/// </summary>
public sealed class BatchingWriteGate : IWriteGate, IAsyncDisposable
{
    /// <summary>Most units of work committed together.</summary>
    public const int MaxBatch = 64;

    private readonly AppDbContextFactory _factory;
    private readonly Channel<Unit> _queue = Channel.CreateUnbounded<Unit>(new UnboundedChannelOptions { SingleReader = true });
    private readonly Task _loop;

    public BatchingWriteGate(AppDbContextFactory factory)
    {
        _factory = factory;
        _loop = Task.Run(LoopAsync);
    }

    public Task<T> RunAsync<T>(Func<AppDbContext, CancellationToken, Task<T>> work, CancellationToken ct = default)
    {
        ct.ThrowIfCancellationRequested();
        var unit = new Unit<T>(work, ct);
        if (!_queue.Writer.TryWrite(unit))
        {
            throw new ObjectDisposedException(nameof(BatchingWriteGate), "The application is shutting down; nothing was stored.");
        }

        return unit.Task;
    }

    public async ValueTask DisposeAsync()
    {
        _queue.Writer.TryComplete();
        await _loop;
    }

    private async Task LoopAsync()
    {
        var batch = new List<Unit>(MaxBatch);
        while (await _queue.Reader.WaitToReadAsync())
        {
            batch.Clear();
            while (batch.Count < MaxBatch && _queue.Reader.TryRead(out var unit))
            {
                if (!unit.CancelIfRequested())
                {
                    batch.Add(unit);
                }
            }

            if (batch.Count > 0)
            {
                await RunBatchAsync(batch);
            }
        }
    }

    private async Task RunBatchAsync(List<Unit> batch)
    {
        var done = new List<Unit>(batch.Count);
        try
        {
            await using var db = _factory.CreateDbContext();
            await using var tx = await db.Database.BeginTransactionAsync();
            for (var i = 0; i < batch.Count; i++)
            {
                var unit = batch[i];
                var savepoint = $"unit{i}";
                await tx.CreateSavepointAsync(savepoint);
                try
                {
                    await unit.RunAsync(db);
                    await tx.ReleaseSavepointAsync(savepoint);
                    done.Add(unit);
                }
                catch (Exception ex)
                {
                    await tx.RollbackToSavepointAsync(savepoint);
                    unit.Fail(ex);
                }
                finally
                {
                    db.ChangeTracker.Clear();
                }
            }

            await tx.CommitAsync();
        }
        catch (Exception ex)
        {
            // The transaction (or opening it) failed: nothing of this batch is stored.
            foreach (var unit in batch)
            {
                unit.Fail(ex);
            }

            return;
        }

        foreach (var unit in done)
        {
            unit.Complete();
        }
    }

    private abstract class Unit
    {
        public abstract Task RunAsync(AppDbContext db);

        public abstract void Complete();

        public abstract void Fail(Exception ex);

        public abstract bool CancelIfRequested();
    }

    private sealed class Unit<T>(Func<AppDbContext, CancellationToken, Task<T>> work, CancellationToken ct) : Unit
    {
        private readonly TaskCompletionSource<T> _tcs = new(TaskCreationOptions.RunContinuationsAsynchronously);
        private T? _result;

        public Task<T> Task => _tcs.Task;

        public override async Task RunAsync(AppDbContext db) => _result = await work(db, ct);

        public override void Complete() => _tcs.TrySetResult(_result!);

        public override void Fail(Exception ex) => _tcs.TrySetException(ex);

        public override bool CancelIfRequested() => ct.IsCancellationRequested && _tcs.TrySetCanceled(ct);
    }
}
