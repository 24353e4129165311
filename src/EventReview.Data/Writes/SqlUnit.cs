using System.Data.Common;

namespace EventReview.Data.Writes;

/// <summary>
/// One unit of hand-written SQL run by the write gate (<see cref="IWriteGate.RunSqlAsync"/>): the connection and the
/// transaction to use, and commands for it. On the embedded database's single writer a command is prepared once and
/// kept for the life of the writer's connection, so a statement is compiled once, not on every request.
/// </summary>
public sealed class SqlUnit : IDisposable
{
    private readonly Dictionary<string, DbCommand>? _prepared;
    private readonly List<DbCommand> _owned = [];

    internal SqlUnit(DatabaseProvider provider, DbConnection connection, DbTransaction transaction, Dictionary<string, DbCommand>? prepared, Records.RecordKeeping? records = null,
        ChainHeadCache? heads = null, bool deferSavepoint = false)
    {
        Provider = provider;
        Connection = connection;
        Transaction = transaction;
        _prepared = prepared;
        _records = records;
        HeadCache = heads;
        Savepoint = deferSavepoint ? SavepointState.Deferred : SavepointState.None;
    }

    /// <summary>Name of the savepoint a unit of the PostgreSQL writer runs in.</summary>
    internal const string SavepointName = "eventreview_sql";

    /// <summary>Where this unit's savepoint is: none to take (its transaction is its own), still to be sent, open, or released.</summary>
    internal enum SavepointState
    {
        None,
        Deferred,
        Open,
        Released,
    }

    internal SavepointState Savepoint { get; set; }

    /// <summary>
    /// The writer's remembered chain heads (PostgreSQL's single writer only; null elsewhere), which let an append skip
    /// reading the case when nothing changed it since (see <see cref="EvidenceAppendPostgres"/>).
    /// </summary>
    internal ChainHeadCache? HeadCache { get; }

    private readonly Records.RecordKeeping? _records;

    /// <summary>Heads of the chain entries this unit wrote (for the witness, once committed).</summary>
    public List<Records.WitnessedHead> Heads { get; } = [];

    /// <summary>Signs a timeline entry the unit is about to insert (as every save does) and notes its head for the witness.</summary>
    public void Sign(Core.Cases.TimelineEntry entry)
    {
        ArgumentNullException.ThrowIfNull(entry);
        Heads.Add(_records?.Sign(entry) ?? new Records.WitnessedHead(entry.Chain, entry.Sequence, entry.Hash));
    }

    public DatabaseProvider Provider { get; }

    public DbConnection Connection { get; }

    public DbTransaction Transaction { get; }

    /// <summary>
    /// A command for <paramref name="sql"/> with the named parameters (the caller sets their values before running it;
    /// use <see cref="DBNull.Value"/> for null). The same text always gets the same parameters.
    /// </summary>
    public DbCommand Command(string sql, params string[] parameters)
    {
        if (Savepoint == SavepointState.Deferred)
        {
            // The unit's savepoint travels with its first statement (one round trip instead of two).
            sql = $"SAVEPOINT {SavepointName};\n{sql}";
            Savepoint = SavepointState.Open;
        }

        if (_prepared is not null && _prepared.TryGetValue(sql, out var kept))
        {
            kept.Transaction = Transaction;
            return kept;
        }

        var command = Connection.CreateCommand();
        command.CommandText = sql;
        command.Transaction = Transaction;
        foreach (var name in parameters)
        {
            var p = command.CreateParameter();
            p.ParameterName = name;
            p.Value = DBNull.Value;
            command.Parameters.Add(p);
        }

        if (_prepared is not null)
        {
            command.Prepare();
            _prepared[sql] = command;
        }
        else
        {
            _owned.Add(command);
        }

        return command;
    }

    /// <summary>
    /// The command for <paramref name="sql"/> (see <see cref="Command"/>) with its parameters set to the given values
    /// (null becomes <see cref="DBNull.Value"/>), ready to run.
    /// </summary>
    public DbCommand Bound(string sql, params (string Name, object? Value)[] values)
    {
        var command = Command(sql, Array.ConvertAll(values, v => v.Name));
        foreach (var (name, value) in values)
        {
            command.Parameters[name].Value = value ?? DBNull.Value;
        }

        return command;
    }

    /// <summary>
    /// Runs <paramref name="statements"/> in one round trip (PostgreSQL); statements that change something
    /// (<paramref name="writes"/>) run inside the unit's savepoint, sent with them and released at their end. With the
    /// writer's shared round trips (<see cref="Pipe"/>) the statements wait for the next one instead, whose own savepoint
    /// leaves nothing of them behind when it fails. Returns the rows each statement affected. <paramref name="read"/> reads the results: it is called once per statement that returns rows, with their
    /// count so far (0 for the first such statement).
    /// A failing statement's error is thrown.
    /// </summary>
    internal async Task<int[]> BatchAsync(IReadOnlyList<(string Sql, (string Name, object? Value)[] Values)> statements, bool writes,
        Func<int, DbDataReader, CancellationToken, Task>? read, CancellationToken ct, int? caseId = null)
    {
        if (Pipe is not null)
        {
            // The writer's shared round trip has a savepoint of its own, which undoes it when a statement fails: the
            // unit needs none. Once they ran, its changes are the transaction's and cannot be undone alone.
            while (true)
            {
                var waiting = Pipe.Add(statements, read, caseId);
                try
                {
                    var done = await waiting.Done.Task;
                    if (writes && Savepoint == SavepointState.Deferred)
                    {
                        Savepoint = SavepointState.Released;
                    }

                    return done;
                }
                catch (RoundTripPipe.NotSentException)
                {
                    // The shared round trip failed and was undone, with nothing of these statements left: send them again.
                }
            }
        }

        // Reads change nothing: no savepoint to undo them.
        var all = new List<(string Sql, (string Name, object? Value)[] Values)>(statements.Count + 2);
        var first = writes && Savepoint == SavepointState.Deferred ? 1 : 0;
        if (first == 1)
        {
            all.Add(($"SAVEPOINT {SavepointName}", []));
            Savepoint = SavepointState.Open;
        }

        all.AddRange(statements);
        var releasing = writes && Savepoint == SavepointState.Open;
        if (releasing)
        {
            all.Add(($"RELEASE {SavepointName}", []));
        }

        var affected = await RunNowAsync(all, read, ct);
        if (releasing)
        {
            Savepoint = SavepointState.Released;
        }

        return affected.Skip(first).Take(statements.Count).ToArray();
    }

    /// <summary>
    /// Waits, while other units' statements waiting for the writer's next round trip write case <paramref name="caseId"/>,
    /// until they are stored (see <see cref="RoundTripPipe.HoldsCase"/>).
    /// </summary>
    internal async Task WaitForCaseAsync(int caseId)
    {
        while (Pipe?.HoldsCase(caseId) == true)
        {
            await Pipe.Add([], null, null).Done.Task;
        }
    }

    /// <summary>The writer's shared round trips (PostgreSQL's single writer only).</summary>
    internal RoundTripPipe? Pipe { get; init; }

    private async Task<int[]> RunNowAsync(List<(string Sql, (string Name, object? Value)[] Values)> all, Func<int, DbDataReader, CancellationToken, Task>? read, CancellationToken ct)
    {
        await using var batch = Connection.CreateBatch();
        batch.Transaction = Transaction;
        foreach (var (sql, values) in all)
        {
            batch.BatchCommands.Add(NewBatchCommand(batch, sql, values));
        }

        await using (var reader = await batch.ExecuteReaderAsync(ct))
        {
            var index = 0;
            do
            {
                if (reader.FieldCount > 0 && read is not null)
                {
                    await read(index++, reader, ct);
                }
            }
            while (await reader.NextResultAsync(ct));
        }

        return batch.BatchCommands.Select(c => c.RecordsAffected).ToArray();
    }

    /// <summary>A command of <paramref name="batch"/> for <paramref name="sql"/> with its parameters' values (null becomes <see cref="DBNull.Value"/>).</summary>
    internal static DbBatchCommand NewBatchCommand(DbBatch batch, string sql, (string Name, object? Value)[] values)
    {
        var command = batch.CreateBatchCommand();
        command.CommandText = sql;
        foreach (var (name, value) in values)
        {
            var p = command.CreateParameter();
            p.ParameterName = name;
            p.Value = value ?? DBNull.Value;
            command.Parameters.Add(p);
        }

        return command;
    }

    /// <summary>A time as the database stores it: exact UTC ticks in SQLite, <c>timestamp with time zone</c> in PostgreSQL.</summary>
    public object Time(DateTimeOffset t) => Provider == DatabaseProvider.Sqlite ? t.UtcTicks : t.ToUniversalTime();

    /// <summary>Reads a time stored by <see cref="Time"/>, with offset zero.</summary>
    public DateTimeOffset ReadTime(DbDataReader reader, int ordinal) => Provider == DatabaseProvider.Sqlite
        ? new DateTimeOffset(reader.GetInt64(ordinal), TimeSpan.Zero)
        : reader.GetFieldValue<DateTimeOffset>(ordinal).ToUniversalTime();

    public void Dispose()
    {
        foreach (var c in _owned)
        {
            c.Dispose();
        }

        _owned.Clear();
    }
}
