using Npgsql;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>Fresh, empty databases on the throwaway PostgreSQL server that ./test.sh starts (EVENTREVIEW_TEST_POSTGRES).</summary>
public static class PostgresDatabases
{
    /// <summary>Creates a database with a random name and returns its connection string.</summary>
    public static async Task<string> FreshAsync(string prefix = "er_web")
    {
        var admin = Environment.GetEnvironmentVariable("EVENTREVIEW_TEST_POSTGRES");
        Assert.False(string.IsNullOrWhiteSpace(admin),
            "EVENTREVIEW_TEST_POSTGRES is not set: run ./test.sh (it starts a throwaway PostgreSQL server) or set it to a throwaway server's connection string.");
        var name = $"{prefix}_{Guid.NewGuid():N}"[..24];
        await using (var conn = new NpgsqlConnection(admin))
        {
            await conn.OpenAsync();
            await using var create = new NpgsqlCommand($"CREATE DATABASE \"{name}\"", conn);
            await create.ExecuteNonQueryAsync();
        }

        return new NpgsqlConnectionStringBuilder(admin) { Database = name }.ConnectionString;
    }
}
