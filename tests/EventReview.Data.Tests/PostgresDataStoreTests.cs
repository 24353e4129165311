using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests;

/// <summary>The shared data tests against PostgreSQL (one database for this class on a throwaway server).</summary>
[Collection(PostgresCollection.Name)]
public sealed class PostgresDataStoreTests(PostgresServer server) : DataStoreTests
{
    private readonly TempFolder _folder = new("er-pg-data");

    protected override async Task<DatabaseSettings> SettingsAsync() =>
        new(DatabaseProvider.Postgres, await server.DatabaseAsync(nameof(PostgresDataStoreTests)), _folder.Path);

    protected override object StoredTime(DateTimeOffset at) => at.ToUniversalTime();

    public override Task DisposeAsync()
    {
        _folder.Dispose();
        return Task.CompletedTask;
    }

    [Fact]
    public void The_server_in_use_is_a_throwaway_one_or_the_one_named_in_the_environment()
    {
        var given = Environment.GetEnvironmentVariable(PostgresServer.EnvironmentVariable);

        Assert.Equal(string.IsNullOrWhiteSpace(given), server.OwnsServer);
        Assert.Contains("Host=", server.AdminConnectionString, StringComparison.Ordinal);
    }
}
