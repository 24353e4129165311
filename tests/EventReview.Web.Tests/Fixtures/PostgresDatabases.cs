using Npgsql;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>
/// Fresh, empty databases for the web tests that run against PostgreSQL, on one <see cref="PostgresServer"/> for the
/// whole run: the throwaway server ./test.sh starts (EVENTREVIEW_TEST_POSTGRES), or, as the data tests do, one this
/// run starts itself from Debian's binaries and stops when the test process ends.
/// </summary>
public static class PostgresDatabases
{
    private static readonly Lazy<Task<PostgresServer>> Server = new(StartAsync);

    /// <summary>Creates a database with a random name and returns its connection string.</summary>
    public static async Task<string> FreshAsync(string prefix = "er_web")
    {
        var server = await Server.Value;
        var name = $"{prefix}_{Guid.NewGuid():N}"[..24];
        await using (var conn = new NpgsqlConnection(server.AdminConnectionString))
        {
            await conn.OpenAsync();
            await using var create = new NpgsqlCommand($"CREATE DATABASE \"{name}\"", conn);
            await create.ExecuteNonQueryAsync();
        }

        return new NpgsqlConnectionStringBuilder(server.AdminConnectionString) { Database = name, Pooling = true }.ConnectionString;
    }

    private static async Task<PostgresServer> StartAsync()
    {
        var server = new PostgresServer();
        await server.InitializeAsync();
        if (server.OwnsServer)
        {
            // xunit 2 has no fixture for a whole assembly: stop the server this run started when the process ends.
            AppDomain.CurrentDomain.ProcessExit += (_, _) => server.DisposeAsync().GetAwaiter().GetResult();
        }

        return server;
    }
}
