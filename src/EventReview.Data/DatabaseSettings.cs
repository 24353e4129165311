namespace EventReview.Data;

/// <summary>
/// Where the data lives. Configuration keys: <c>EventReview:DataDirectory</c> (default <c>./data</c>: the SQLite file
/// <c>eventreview.db</c> and the attachment store), <c>Database:Provider</c> (<c>Sqlite</c> or <c>Postgres</c>) and
/// <c>ConnectionStrings:Default</c> (required for Postgres; optional override for SQLite).
/// </summary>
public sealed record DatabaseSettings(DatabaseProvider Provider, string ConnectionString, string DataDirectory)
{
    /// <summary>File name of the embedded database inside the data folder.</summary>
    public const string SqliteFileName = "eventreview.db";

    /// <summary>Folder of content-addressed attachments inside the data folder.</summary>
    public string AttachmentDirectory => Path.Combine(DataDirectory, "attachments");

    /// <summary>SQLite settings for a data folder.</summary>
    public static DatabaseSettings ForSqlite(string dataDirectory)
    {
        var full = Path.GetFullPath(dataDirectory);
        return new DatabaseSettings(DatabaseProvider.Sqlite, $"Data Source={Path.Combine(full, SqliteFileName)};Pooling=True", full);
    }

    /// <summary>Builds settings from configuration values (any may be null).</summary>
    /// <exception cref="ArgumentException">When the provider is unknown or Postgres has no connection string.</exception>
    public static DatabaseSettings From(string? provider, string? connectionString, string? dataDirectory)
    {
        var dir = Path.GetFullPath(string.IsNullOrWhiteSpace(dataDirectory) ? "./data" : dataDirectory);
        var p = provider?.Trim().ToLowerInvariant() switch
        {
            null or "" or "sqlite" => DatabaseProvider.Sqlite,
            "postgres" or "postgresql" or "npgsql" => DatabaseProvider.Postgres,
            _ => throw new ArgumentException($"Database:Provider '{provider}' is not known; use Sqlite or Postgres.", nameof(provider)),
        };
        if (p == DatabaseProvider.Postgres)
        {
            if (string.IsNullOrWhiteSpace(connectionString))
            {
                throw new ArgumentException("Database:Provider is Postgres but ConnectionStrings:Default is empty.", nameof(connectionString));
            }

            return new DatabaseSettings(p, connectionString, dir);
        }

        return string.IsNullOrWhiteSpace(connectionString) ? ForSqlite(dir) : new DatabaseSettings(p, connectionString, dir);
    }
}
