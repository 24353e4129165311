using System.Data.Common;
using Npgsql;

namespace EventReview.Data.Writes;

/// <summary>
/// Shares PostgreSQL round trips between the units of one batch of the writer (<see cref="BatchingWriteGate"/>). A
/// unit's statements (<see cref="SqlUnit.BatchAsync"/>) are not sent at once: the unit waits here while the writer
/// starts the next unit of the batch, and when every unit waits or is done, all their statements go to the server in
/// one round trip, in the order of the batch, inside a savepoint of the round trip; then each unit continues, one after
/// the other in that order. A batch of appends thus costs one or two round trips, not one or two per append. When a
/// statement fails, the round trip is rolled back to its savepoint, so nothing of it remains: alone in it, the unit gets
/// the error; with others, every unit sends its statements again, and for the rest of the batch each unit has a round
/// trip of its own, so that an error is its own unit's. A unit that would write a case another unit's waiting
/// statements write waits for their round trip first (<see cref="HoldsCase"/>), so that it plans from what they stored.
/// Used by the writer's loop only: units run one at a time, each until it waits here or is done.
/// </summary>
internal sealed class RoundTripPipe
{
    private readonly List<Waiting> _waiting = [];
    private readonly HashSet<int> _cases = [];
    private TaskCompletionSource _parked = new(TaskCreationOptions.RunContinuationsAsynchronously);

    /// <summary>One unit's statements waiting for the round trip, and what it learns from it.</summary>
    internal sealed class Waiting(IReadOnlyList<(string Sql, (string Name, object? Value)[] Values)> statements, Func<int, DbDataReader, CancellationToken, Task>? read)
    {
        public IReadOnlyList<(string Sql, (string Name, object? Value)[] Values)> Statements { get; } = statements;

        public Func<int, DbDataReader, CancellationToken, Task>? Read { get; } = read;

        public TaskCompletionSource<int[]> Done { get; } = new(TaskCreationOptions.RunContinuationsAsynchronously);

        /// <summary>Set when an earlier statement of the round trip failed, so these were never run.</summary>
        public bool NotSent { get; set; }

        internal int[]? Affected { get; set; }

        internal Exception? Error { get; set; }
    }

    /// <summary>
    /// Forgets whatever waits (the batch failed and every caller got its error): those units never continue, and nothing
    /// of theirs is sent with the next batch.
    /// </summary>
    public void Reset()
    {
        _waiting.Clear();
        _cases.Clear();
    }

    /// <summary>Round trips made (for the writer's figures).</summary>
    public long RoundTrips { get; private set; }

    /// <summary>True when statements waiting for the next round trip write case <paramref name="caseId"/>.</summary>
    public bool HoldsCase(int caseId) => _cases.Contains(caseId);

    /// <summary>Adds a unit's statements to the next round trip (<paramref name="caseId"/>: the case they write, if any); the task ends after it.</summary>
    public Waiting Add(IReadOnlyList<(string Sql, (string Name, object? Value)[] Values)> statements, Func<int, DbDataReader, CancellationToken, Task>? read, int? caseId)
    {
        var w = new Waiting(statements, read);
        _waiting.Add(w);
        if (caseId is { } id)
        {
            _cases.Add(id);
        }

        _parked.TrySetResult();
        return w;
    }

    /// <summary>Call before a unit starts or continues: <see cref="WaitAsync"/> then tells whether it waits here.</summary>
    public void Arm() => _parked = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);

    /// <summary>Waits until the unit running as <paramref name="run"/> waits here (true) or ends (false).</summary>
    public async Task<bool> WaitAsync(Task run)
    {
        await Task.WhenAny(run, _parked.Task);
        return !run.IsCompleted;
    }

    /// <summary>Call when a batch starts: round trips are shared again.</summary>
    public void BeginBatch()
    {
        Reset();
        _alone = false;
    }

    private bool _alone;

    /// <summary>
    /// Sends the waiting statements in one round trip inside a savepoint of its own and records each unit's outcome;
    /// returns the units' entries in order, for the writer to let them continue (<see cref="Release"/>). When a
    /// statement fails, the round trip is rolled back to its savepoint, so that nothing of it remains: with one unit in
    /// it, that unit gets the error; with several, each sends its statements again, and for the rest of the batch each
    /// unit has a round trip of its own, so that an error is its own unit's.
    /// </summary>
    public async Task<List<Waiting>> FlushAsync(DbConnection connection, DbTransaction tx)
    {
        var waiting = _waiting.ToList();
        _waiting.Clear();
        _cases.Clear();
        var sending = waiting.Where(w => w.Statements.Count > 0).ToList();
        if (_alone)
        {
            foreach (var w in sending.Skip(1))
            {
                w.NotSent = true;
            }

            sending = sending.Take(1).ToList();
        }

        if (sending.Count == 0)
        {
            return waiting;
        }

        RoundTrips++;
        await using var batch = (NpgsqlBatch)connection.CreateBatch();
        batch.Transaction = (NpgsqlTransaction)tx;
        batch.BatchCommands.Add(SqlUnit.NewBatchCommand(batch, $"SAVEPOINT {Savepoint}", []));
        var rowSets = new List<Waiting>();
        foreach (var w in sending)
        {
            foreach (var (sql, values) in w.Statements)
            {
                batch.BatchCommands.Add(SqlUnit.NewBatchCommand(batch, sql, values));
                if (ReturnsRows(sql))
                {
                    rowSets.Add(w);
                }
            }
        }

        batch.BatchCommands.Add(SqlUnit.NewBatchCommand(batch, $"RELEASE {Savepoint}", []));
        try
        {
            await using (var reader = await batch.ExecuteReaderAsync())
            {
                var set = 0;
                var seen = new Dictionary<Waiting, int>();
                do
                {
                    if (reader.FieldCount > 0)
                    {
                        // Result sets come in the order of the statements that return rows.
                        var w = rowSets[set++];
                        var n = seen.GetValueOrDefault(w);
                        seen[w] = n + 1;
                        if (w.Read is not null)
                        {
                            await w.Read(n, reader, CancellationToken.None);
                        }
                    }
                }
                while (await reader.NextResultAsync());
            }

            var k = 1;
            foreach (var w in sending)
            {
                w.Affected = w.Statements.Select((_, i) => batch.BatchCommands[k + i].RecordsAffected).ToArray();
                k += w.Statements.Count;
            }
        }
        catch (PostgresException ex)
        {
            // Undo the whole round trip (its savepoint still stands: the failing statement came after it).
            await using (var undo = connection.CreateCommand())
            {
                undo.Transaction = tx;
                undo.CommandText = $"ROLLBACK TO {Savepoint}; RELEASE {Savepoint}";
                await undo.ExecuteNonQueryAsync();
            }

            if (sending.Count == 1)
            {
                sending[0].Error = ex;
            }
            else
            {
                _alone = true;
                foreach (var w in sending)
                {
                    w.NotSent = true; // what a unit read from the undone round trip it reads again (its readers start afresh)
                }
            }
        }

        return waiting;
    }

    /// <summary>Name of the savepoint around each shared round trip.</summary>
    private const string Savepoint = "eventreview_round";

    /// <summary>Lets a unit continue after the round trip: with its statements' affected rows, its error, or "not sent".</summary>
    public static void Release(Waiting w)
    {
        if (w.NotSent)
        {
            w.Done.TrySetException(new NotSentException());
        }
        else if (w.Error is not null)
        {
            w.Done.TrySetException(w.Error);
        }
        else
        {
            w.Done.TrySetResult(w.Affected ?? []);
        }
    }

    /// <summary>True for statements that return rows (a SELECT, or anything with RETURNING).</summary>
    internal static bool ReturnsRows(string sql) =>
        sql.TrimStart().StartsWith("SELECT", StringComparison.OrdinalIgnoreCase) || sql.Contains("RETURNING", StringComparison.OrdinalIgnoreCase);

    /// <summary>The unit's statements were not run because an earlier statement of the round trip failed; it sends them again.</summary>
    internal sealed class NotSentException() : Exception("An earlier statement of the shared round trip failed; these statements were not run.");
}
