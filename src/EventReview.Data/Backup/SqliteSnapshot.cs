using Microsoft.Data.Sqlite;

namespace EventReview.Data.Backup;

/// <summary>A consistent copy of a live SQLite database, taken while other processes go on writing to it.</summary>
internal static class SqliteSnapshot
{
    /// <summary>
    /// Copies <paramref name="sourcePath"/> to <paramref name="destinationPath"/> (which must not exist) as of one
    /// committed state, then turns the copy into a self-contained rollback-journal file and checks its integrity.
    /// </summary>
    /// <remarks>
    /// Uses SQLite's online backup API (<see cref="SqliteConnection.BackupDatabase(SqliteConnection)"/>, which runs
    /// <c>sqlite3_backup_step(-1)</c>: every page in one step) inside an explicit read transaction on the source, rather
    /// than <c>VACUUM INTO</c>. Both read one snapshot, so both are consistent, and in WAL mode neither blocks writers
    /// (they go on appending to the WAL; only a checkpoint waits for our reader). The backup API copies pages as they are,
    /// so it is cheap and short; <c>VACUUM INTO</c> rebuilds every table and index, which costs more CPU and keeps the read
    /// transaction (and the WAL growing) longer. Doing the whole copy in one step also avoids the restart that the backup
    /// API makes when another connection writes between two steps. The read transaction is begun through a normal
    /// command first so that a momentary SQLITE_BUSY (WAL recovery by another process) is retried under the busy timeout.
    /// </remarks>
    public static void Copy(string sourcePath, string destinationPath)
    {
        if (!File.Exists(sourcePath))
        {
            throw new BackupException($"There is no database at {sourcePath}.");
        }

        var sourceCs = new SqliteConnectionStringBuilder { DataSource = sourcePath, Mode = SqliteOpenMode.ReadWrite, Pooling = false, DefaultTimeout = 60 };
        var destCs = new SqliteConnectionStringBuilder { DataSource = destinationPath, Mode = SqliteOpenMode.ReadWriteCreate, Pooling = false };
        using (var source = new SqliteConnection(sourceCs.ConnectionString))
        using (var destination = new SqliteConnection(destCs.ConnectionString))
        {
            source.Open();
            Execute(source, "PRAGMA busy_timeout = 60000;");
            using var read = source.BeginTransaction(deferred: true);
            Execute(source, "SELECT count(*) FROM sqlite_master;", read); // takes the read snapshot now
            destination.Open();
            source.BackupDatabase(destination);
            read.Rollback();
        }

        using var copy = new SqliteConnection(destCs.ConnectionString);
        copy.Open();
        Execute(copy, "PRAGMA journal_mode = DELETE;");
        var answer = Execute(copy, "PRAGMA integrity_check;");
        if (!string.Equals(answer, "ok", StringComparison.OrdinalIgnoreCase))
        {
            throw new BackupException($"The database copy failed SQLite's integrity check: {answer}");
        }
    }

    private static string? Execute(SqliteConnection connection, string sql, SqliteTransaction? transaction = null)
    {
        using var cmd = connection.CreateCommand();
        cmd.CommandText = sql;
        cmd.Transaction = transaction;
        return cmd.ExecuteScalar()?.ToString();
    }
}
