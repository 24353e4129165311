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
    public void Sign(Core.Cases.ActivityEntry entry)
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
    /// Runs <paramref name="statements"/> in one round trip (PostgreSQL), preceded by the unit's savepoint while it is
    /// still to be sent, and followed by its release when <paramref name="release"/>; returns the rows each statement
    /// affected. <paramref name="read"/> reads the results: it is called once per statement that returns rows, with their
    /// count so far (0 for the first such statement).
    /// A failing statement stops the batch there and its error is thrown; the unit's savepoint is then open.
    /// </summary>
    internal async Task<int[]> BatchAsync(IReadOnlyList<(string Sql, (string Name, object? Value)[] Values)> statements, bool release,
        Func<int, DbDataReader, CancellationToken, Task>? read, CancellationToken ct)
    {
        await using var batch = Connection.CreateBatch();
        batch.Transaction = Transaction;
        var first = 0;
        if (Savepoint == SavepointState.Deferred)
        {
            Add(batch, $"SAVEPOINT {SavepointName}", []);
            first = 1;
        }

        foreach (var (sql, values) in statements)
        {
            Add(batch, sql, values);
        }

        if (release)
        {
            Add(batch, $"RELEASE {SavepointName}", []);
        }

        if (first == 1)
        {
            Savepoint = SavepointState.Open;
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

        if (release)
        {
            Savepoint = SavepointState.Released;
        }

        var affected = new int[statements.Count];
        for (var i = 0; i < affected.Length; i++)
        {
            affected[i] = batch.BatchCommands[first + i].RecordsAffected;
        }

        return affected;
    }

    private static void Add(DbBatch batch, string sql, (string Name, object? Value)[] values)
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

        batch.BatchCommands.Add(command);
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
