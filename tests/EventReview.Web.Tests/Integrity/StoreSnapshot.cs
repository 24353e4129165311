using System.Data.Common;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Integrity;

/// <summary>
/// What a refused request could have changed, in one comparable text: the row count of every table of the model,
/// the head (newest sequence and hash) of every case timeline and of the sign-in audit chain, and the files of the
/// data folder (the SQLite file and its companions excepted: they change size on their own).
/// </summary>
public static class StoreSnapshot
{
    /// <summary>Table whose rows a sign-in adds by design (the audit of the attempt).</summary>
    public const string AccountEvents = "AccountEvents";

    public static async Task<string> TakeAsync(EventReviewFactory app, IReadOnlyCollection<string>? except = null)
    {
        except ??= [];
        await using var db = app.Db();
        var tables = db.Model.GetEntityTypes().Select(e => e.GetTableName()).OfType<string>().Distinct().Where(t => !except.Contains(t)).Order(StringComparer.Ordinal).ToList();
        var lines = new List<string>();
        var connection = db.Database.GetDbConnection();
        await connection.OpenAsync();
        foreach (var table in tables)
        {
            lines.Add($"{table} {await ScalarAsync(connection, $"SELECT COUNT(*) FROM \"{table}\"")}");
        }

        lines.AddRange(await RowsAsync(connection,
            "SELECT a.\"ReviewCaseId\", a.\"Sequence\", a.\"Hash\" FROM \"Timeline\" a " +
            "WHERE a.\"Sequence\" = (SELECT MAX(b.\"Sequence\") FROM \"Timeline\" b WHERE b.\"ReviewCaseId\" = a.\"ReviewCaseId\") ORDER BY a.\"ReviewCaseId\""));
        if (!except.Contains(AccountEvents))
        {
            lines.AddRange(await RowsAsync(connection, "SELECT \"Sequence\", \"Hash\" FROM \"AccountEvents\" ORDER BY \"Sequence\" DESC LIMIT 1"));
        }

        lines.AddRange(Directory.EnumerateFiles(app.DataDirectory, "*", SearchOption.AllDirectories)
            .Select(f => Path.GetRelativePath(app.DataDirectory, f))
            .Where(f => !f.StartsWith(Data.DatabaseSettings.SqliteFileName, StringComparison.Ordinal))
            .Order(StringComparer.Ordinal));
        return string.Join('\n', lines);
    }

    private static async Task<object?> ScalarAsync(DbConnection connection, string sql)
    {
        await using var command = connection.CreateCommand();
        command.CommandText = sql;
        return await command.ExecuteScalarAsync();
    }

    private static async Task<List<string>> RowsAsync(DbConnection connection, string sql)
    {
        await using var command = connection.CreateCommand();
        command.CommandText = sql;
        await using var reader = await command.ExecuteReaderAsync();
        var rows = new List<string>();
        while (await reader.ReadAsync())
        {
            rows.Add("head " + string.Join(' ', Enumerable.Range(0, reader.FieldCount).Select(i => Convert.ToString(reader.GetValue(i), System.Globalization.CultureInfo.InvariantCulture))));
        }

        return rows;
    }
}
