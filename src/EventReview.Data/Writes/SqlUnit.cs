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

    internal SqlUnit(DatabaseProvider provider, DbConnection connection, DbTransaction transaction, Dictionary<string, DbCommand>? prepared, Records.RecordKeeping? records = null)
    {
        Provider = provider;
        Connection = connection;
        Transaction = transaction;
        _prepared = prepared;
        _records = records;
    }

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
