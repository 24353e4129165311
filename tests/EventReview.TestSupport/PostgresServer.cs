using System.Net;
using System.Net.Sockets;
using Npgsql;

namespace EventReview.TestSupport;

/// <summary>
/// A PostgreSQL server for the data tests. Uses the connection string in <c>EVENTREVIEW_TEST_POSTGRES</c> when set
/// (./test.sh starts a throwaway server and sets it); otherwise starts its own throwaway server from Debian's
/// binaries (/usr/lib/postgresql/*/bin) in a temp folder on a free local port, with trust authentication, and
/// stops and deletes it on dispose. Missing binaries fail the tests with a message saying how to get them.
/// Each test class gets its own database (<see cref="DatabaseAsync"/>).
/// </summary>
public sealed class PostgresServer : IAsyncLifetime, IDisposable
{
    public const string EnvironmentVariable = "EVENTREVIEW_TEST_POSTGRES";

    private readonly Dictionary<string, string> _databases = new(StringComparer.Ordinal);
    private readonly SemaphoreSlim _lock = new(1, 1);
    private readonly string _runId = Guid.NewGuid().ToString("N")[..8];
    private string? _root;
    private string? _binDirectory;
    private bool _asRoot;

    /// <summary>Connection string to the server's maintenance database.</summary>
    public string AdminConnectionString { get; private set; } = string.Empty;

    /// <summary>True when this fixture started (and will stop) the server itself.</summary>
    public bool OwnsServer => _root is not null;

    public async Task InitializeAsync()
    {
        var given = Environment.GetEnvironmentVariable(EnvironmentVariable);
        if (!string.IsNullOrWhiteSpace(given))
        {
            AdminConnectionString = new NpgsqlConnectionStringBuilder(given) { Pooling = false }.ConnectionString;
            return;
        }

        _binDirectory = FindBinDirectory() ?? throw new InvalidOperationException(
            "PostgreSQL server binaries (initdb, pg_ctl) were not found under /usr/lib/postgresql/*/bin. " +
            "The data tests must also run against PostgreSQL: install Debian's postgresql (apt-get install -y postgresql) or run ./test.sh, " +
            $"or set {EnvironmentVariable} to the connection string of a throwaway server.");
        _asRoot = Environment.UserName == "root";
        _root = Path.Combine(Path.GetTempPath(), $"er-pg-{_runId}");
        var data = Path.Combine(_root, "data");
        Directory.CreateDirectory(_root);
        if (_asRoot)
        {
            await ProcessRunner.RunAsync("chown", ["postgres:postgres", _root], TimeSpan.FromSeconds(30));
        }

        await Run("initdb", ["-D", data, "-U", "postgres", "-A", "trust", "-E", "UTF8", "--locale=C", "--no-sync"], TimeSpan.FromMinutes(2));
        var port = FreePort();
        var options = $"-p {port} -k {_root} -c listen_addresses=127.0.0.1 -c fsync=off -c synchronous_commit=off -c full_page_writes=off";
        await Run("pg_ctl", ["-D", data, "-l", Path.Combine(_root, "server.log"), "-o", options, "-w", "-t", "60", "start"], TimeSpan.FromSeconds(90));
        AdminConnectionString = $"Host=127.0.0.1;Port={port};Username=postgres;Database=postgres;Pooling=false;Timeout=30";
    }

    /// <summary>A connection string to a database for <paramref name="owner"/> (created empty on first request).</summary>
    public async Task<string> DatabaseAsync(string owner)
    {
        await _lock.WaitAsync();
        try
        {
            if (_databases.TryGetValue(owner, out var existing))
            {
                return existing;
            }

            var name = $"er_{owner.ToLowerInvariant()}_{_runId}";
            name = new string(name.Select(ch => char.IsAsciiLetterOrDigit(ch) ? ch : '_').ToArray());
            name = name.Length > 60 ? name[..60] : name;
            await using (var conn = new NpgsqlConnection(AdminConnectionString))
            {
                await conn.OpenAsync();
                await using var drop = new NpgsqlCommand($"DROP DATABASE IF EXISTS \"{name}\" WITH (FORCE)", conn);
                await drop.ExecuteNonQueryAsync();
                await using var create = new NpgsqlCommand($"CREATE DATABASE \"{name}\"", conn);
                await create.ExecuteNonQueryAsync();
            }

            var cs = new NpgsqlConnectionStringBuilder(AdminConnectionString) { Database = name, Pooling = true }.ConnectionString;
            _databases[owner] = cs;
            return cs;
        }
        finally
        {
            _lock.Release();
        }
    }

    /// <summary>Releases the database-creation lock (xunit calls this after <see cref="DisposeAsync"/>).</summary>
    public void Dispose() => _lock.Dispose();

    public async Task DisposeAsync()
    {
        NpgsqlConnection.ClearAllPools();
        if (_root is null)
        {
            await DropDatabasesAsync();
            return;
        }

        try
        {
            await Run("pg_ctl", ["-D", Path.Combine(_root, "data"), "-m", "immediate", "-w", "stop"], TimeSpan.FromSeconds(60));
        }
        finally
        {
            Directory.Delete(_root, recursive: true);
        }
    }

    private async Task DropDatabasesAsync()
    {
        await using var conn = new NpgsqlConnection(AdminConnectionString);
        await conn.OpenAsync();
        foreach (var cs in _databases.Values)
        {
            var name = new NpgsqlConnectionStringBuilder(cs).Database;
            await using var drop = new NpgsqlCommand($"DROP DATABASE IF EXISTS \"{name}\" WITH (FORCE)", conn);
            await drop.ExecuteNonQueryAsync();
        }
    }

    private Task<string> Run(string tool, string[] args, TimeSpan timeout)
    {
        var exe = Path.Combine(_binDirectory!, tool);
        return _asRoot
            ? ProcessRunner.RunAsync("runuser", ["-u", "postgres", "--", exe, .. args], timeout)
            : ProcessRunner.RunAsync(exe, args, timeout);
    }

    private static string? FindBinDirectory()
    {
        const string root = "/usr/lib/postgresql";
        if (!Directory.Exists(root))
        {
            return null;
        }

        return Directory.EnumerateDirectories(root)
            .Select(d => Path.Combine(d, "bin"))
            .Where(b => File.Exists(Path.Combine(b, "initdb")) && File.Exists(Path.Combine(b, "pg_ctl")))
            .OrderByDescending(b => int.TryParse(Path.GetFileName(Path.GetDirectoryName(b)), out var v) ? v : 0)
            .FirstOrDefault();
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
