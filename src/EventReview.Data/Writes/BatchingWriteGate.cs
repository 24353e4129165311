using System.Data.Common;
using System.Diagnostics;
using System.Diagnostics.Metrics;
using System.Threading.Channels;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Storage;

namespace EventReview.Data.Writes;

/// <summary>
/// The single writer of each app instance, with group commit, on both providers. SQLite lets one connection write at a
/// time and its driver answers a locked database by sleeping and retrying, so writers queue here instead; on PostgreSQL
/// the same queue makes waiting writes share one transaction and one flush of the log (per-case order across instances
/// is kept by the row lock <c>FOR UPDATE</c> on the case in <see cref="EvidenceAppendSql"/>). Callers read and
/// change on their own contexts in parallel; one loop takes every waiting save (up to <see cref="MaxBatch"/>), runs
/// each on its one connection inside one transaction (each save in its own savepoint, so a failing save is undone
/// alone and its caller gets the error), and commits once: one flush to disk serves the whole batch. Every caller's
/// task completes only after the commit, so nothing is acknowledged before it is durable; if the commit fails, every
/// save of the batch fails with that error and nothing of it is stored. The writer keeps its connection open, and the
/// statements of hand-written units (<see cref="RunSqlAsync"/>) stay prepared on it; after any failure of a batch the
/// connection is closed and a fresh one opened for the next. On SQLite a background task copies committed pages from the
/// write-ahead log into the database file every <see cref="CheckpointEvery"/> (see <see cref="CheckpointLoopAsync"/>).
/// The writer's figures are published as metrics (<see cref="MeterName"/>). After each commit, one witness line with the
/// newest head of every chain the batch changed goes to the witness (<see cref="Records.HeadWitness"/>): one line per
/// batch, not per write. On PostgreSQL the writer remembers the chain heads it wrote (<see cref="ChainHeadCache"/>), so an
/// append to a case it wrote last needs one round trip and no read (<see cref="EvidenceAppendPostgres"/>).
/// </summary>
public sealed partial class BatchingWriteGate : IWriteGate, IAsyncDisposable
{
    /// <summary>Most saves committed together.</summary>
    public const int MaxBatch = 64;

    /// <summary>Times a unit runs when PostgreSQL keeps choosing it to break a lock cycle, before its caller gets the error.</summary>
    public const int MaxAttempts = 5;

    /// <summary>How often the background checkpoint runs when something was committed.</summary>
    public static readonly TimeSpan CheckpointEvery = TimeSpan.FromMilliseconds(100);

    /// <summary>Name of the meter with the writer's figures (watch them with <c>dotnet-counters monitor --counters EventReview.Writes</c>).</summary>
    public const string MeterName = "EventReview.Writes";

    private static readonly Meter Meter = new(MeterName);
    private static readonly Histogram<int> BatchSize = Meter.CreateHistogram<int>("eventreview.writes.batch_size", "{unit}", "Saves committed together in one transaction.");
    private static readonly Histogram<double> BatchTime = Meter.CreateHistogram<double>("eventreview.writes.batch_duration", "ms", "Time from the start of a batch to its commit.");
    private static readonly Histogram<double> CommitTime = Meter.CreateHistogram<double>("eventreview.writes.commit_duration", "ms", "Time of the commit alone (the flush to disk).");
    private static readonly Histogram<long> RoundTrips = Meter.CreateHistogram<long>("eventreview.writes.round_trips", "{round_trip}", "Shared round trips to PostgreSQL in one batch, besides the commit (PostgreSQL only).");
    private static readonly Histogram<double> WaitTime = Meter.CreateHistogram<double>("eventreview.writes.wait_duration", "ms", "Time from handing a save to the writer until it is committed.");

    private readonly AppDbContextFactory _factory;
    private readonly Channel<PendingUnit> _queue = Channel.CreateUnbounded<PendingUnit>(new UnboundedChannelOptions { SingleReader = true });
    private readonly Task _loop;
    private readonly Task _checkpoints;
    private readonly CancellationTokenSource _stop = new();
    private long _commits;
    private readonly Dictionary<string, DbCommand> _prepared = new(StringComparer.Ordinal);
    private readonly ChainHeadCache? _heads;
    private readonly RoundTripPipe? _pipe;
    private AppDbContext? _owner;
    private DbConnection? _connection;

    public BatchingWriteGate(AppDbContextFactory factory)
    {
        _factory = factory;
        _heads = factory.Settings.Provider == DatabaseProvider.Postgres ? new ChainHeadCache() : null;
        _pipe = factory.Settings.Provider == DatabaseProvider.Postgres ? new RoundTripPipe() : null;
        _loop = Task.Run(LoopAsync);
        _checkpoints = factory.Settings.Provider == DatabaseProvider.Sqlite ? Task.Run(CheckpointLoopAsync) : Task.CompletedTask;
    }

    /// <summary>Appends stored from the writer's remembered chain head, without reading the case (PostgreSQL only; read after the writer is idle).</summary>
    public long AppendsFromRememberedHead => _heads?.Hits ?? 0;

    /// <summary>Remembered chain heads the database found out of date, so that the case was read again (PostgreSQL only).</summary>
    public long StaleRememberedHeads => _heads?.Stale ?? 0;

    public Task SaveAsync(AppDbContext db, CancellationToken ct = default)
    {
        var save = new PendingSave(db, _heads, ct);
        Enqueue(save, ct);
        return save.Done.Task;
    }

    public Task<T> RunAsync<T>(Func<AppDbContext, CancellationToken, Task<T>> work, CancellationToken ct = default)
    {
        var run = new PendingRun<T>(_factory, _heads, work, ct);
        Enqueue(run, ct);
        return run.Result.Task;
    }

    public Task<T> RunSqlAsync<T>(Func<SqlUnit, CancellationToken, Task<T>> work, CancellationToken ct = default)
    {
        var run = new PendingSql<T>(this, work, ct);
        Enqueue(run, ct);
        return run.Result.Task;
    }

    private void Enqueue(PendingUnit unit, CancellationToken ct)
    {
        ct.ThrowIfCancellationRequested();
        if (!_queue.Writer.TryWrite(unit))
        {
            throw new ObjectDisposedException(nameof(BatchingWriteGate), "The application is shutting down; nothing was stored.");
        }
    }

    public async ValueTask DisposeAsync()
    {
        _queue.Writer.TryComplete();
        await _loop;
        await _stop.CancelAsync();
        await _checkpoints;
        await CloseWriterAsync();
    }

    /// <summary>The writer's open connection, opened through a context so that the provider sets it up as for any other.</summary>
    private async Task<DbConnection> WriterConnectionAsync()
    {
        if (_connection is { State: System.Data.ConnectionState.Open })
        {
            return _connection;
        }

        await CloseWriterAsync();
        _owner = _factory.CreateDbContext();
        if (_factory.Settings.Provider == DatabaseProvider.Postgres)
        {
            _owner.Database.SetConnectionString(WriterConnectionString(_owner.Database.GetConnectionString()!));
        }

        await _owner.Database.OpenConnectionAsync();
        _connection = _owner.Database.GetDbConnection();
        return _connection;
    }

    /// <summary>
    /// The PostgreSQL writer's connection string: the configured one, with the driver preparing the writer's statements
    /// after their second use (<c>Max Auto Prepare</c>) unless the configuration says otherwise; the writer runs the
    /// same few statements all day on one connection, so the server parses and plans each once.
    /// </summary>
    internal static string WriterConnectionString(string configured)
    {
        var builder = new Npgsql.NpgsqlConnectionStringBuilder(configured);
        if (!configured.Contains("Auto Prepare", StringComparison.OrdinalIgnoreCase) && !configured.Contains("AutoPrepare", StringComparison.OrdinalIgnoreCase))
        {
            builder.MaxAutoPrepare = 32;
            builder.AutoPrepareMinUsages = 2;
        }

        return builder.ConnectionString;
    }

    /// <summary>
    /// Copies committed pages from the write-ahead log into the database file in the background (a PASSIVE checkpoint,
    /// which never waits for readers or the writer), so that when the writer's own automatic checkpoint comes due most
    /// of its copying is already done and it holds up the waiting saves for less time. A failure is retried at the next turn.
    /// </summary>
    private async Task CheckpointLoopAsync()
    {
        var done = 0L;
        using var timer = new PeriodicTimer(CheckpointEvery);
        try
        {
            while (await timer.WaitForNextTickAsync(_stop.Token))
            {
                var commits = Interlocked.Read(ref _commits);
                if (commits == done)
                {
                    continue;
                }

                try
                {
                    await using var db = _factory.CreateDbContext();
                    await db.Database.ExecuteSqlRawAsync("PRAGMA wal_checkpoint(PASSIVE);", _stop.Token);
                    done = commits;
                }
                catch (Exception ex) when (ex is not OperationCanceledException)
                {
                    // Busy or failed this turn: the next one tries again.
                }
            }
        }
        catch (OperationCanceledException)
        {
            // Shutting down.
        }
    }

    private async Task CloseWriterAsync()
    {
        foreach (var command in _prepared.Values)
        {
            await command.DisposeAsync();
        }

        _prepared.Clear();
        if (_owner is not null)
        {
            await _owner.Database.CloseConnectionAsync();
            await _owner.DisposeAsync();
        }

        _owner = null;
        _connection = null;
    }

    private async Task LoopAsync()
    {
        var batch = new List<PendingUnit>(MaxBatch);
        while (await _queue.Reader.WaitToReadAsync())
        {
            batch.Clear();
            while (batch.Count < MaxBatch && _queue.Reader.TryRead(out var save))
            {
                if (save.Cancelled.IsCancellationRequested)
                {
                    save.Cancel();
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

    private async Task RunBatchAsync(List<PendingUnit> batch)
    {
        var saved = new List<PendingUnit>(batch.Count);
        var retry = new List<PendingUnit>();
        var started = Stopwatch.GetTimestamp();
        var roundTripsBefore = _pipe?.RoundTrips ?? 0;
        try
        {
            var connection = await WriterConnectionAsync();
            await using var tx = await connection.BeginTransactionAsync();
            if (_pipe is null)
            {
                foreach (var unit in batch)
                {
                    // Each unit saves through the writer's connection and transaction; EF Core wraps the save in a
                    // savepoint of that transaction and rolls back to it if the save fails.
                    await Settle(unit, unit.ExecuteAsync(connection, tx), saved, retry);
                }
            }
            else
            {
                await RunSharingRoundTripsAsync(batch, connection, tx, saved, retry);
            }

            if (_pipe is not null)
            {
                RoundTrips.Record(_pipe.RoundTrips - roundTripsBefore);
            }

            var committing = Stopwatch.GetTimestamp();
            await tx.CommitAsync();
            _factory.Records?.Committed(saved.SelectMany(u => u.Heads).ToList());
            Interlocked.Increment(ref _commits);
            CommitTime.Record(Stopwatch.GetElapsedTime(committing).TotalMilliseconds);
            BatchTime.Record(Stopwatch.GetElapsedTime(started).TotalMilliseconds);
            BatchSize.Record(batch.Count);
        }
        catch (Exception ex)
        {
            // The transaction (or opening it) failed: nothing of this batch is stored. Start the next on a fresh connection,
            // remembering no chain head (some were of appends now undone).
            _heads?.Clear();
            _pipe?.Reset();
            await CloseWriterAsync();
            foreach (var unit in batch)
            {
                unit.Fail(ex);
            }

            return;
        }

        foreach (var unit in retry)
        {
            if (!_queue.Writer.TryWrite(unit))
            {
                unit.Fail(new ObjectDisposedException(nameof(BatchingWriteGate), "The application is shutting down; nothing was stored."));
            }
        }

        var now = Stopwatch.GetTimestamp();
        foreach (var unit in saved)
        {
            WaitTime.Record(Stopwatch.GetElapsedTime(unit.Queued, now).TotalMilliseconds);
            unit.Complete();
        }
    }

    /// <summary>A deadlock or serialisation failure reported by PostgreSQL (SQLSTATE 40P01, 40001), possibly wrapped.</summary>
    private static bool IsLockConflict(Exception? ex)
    {
        for (; ex is not null; ex = ex.InnerException)
        {
            if (ex is Npgsql.PostgresException { SqlState: "40P01" or "40001" })
            {
                return true;
            }
        }

        return false;
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
}
