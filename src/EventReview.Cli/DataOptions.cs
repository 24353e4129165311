using System.CommandLine;
using EventReview.Data;
using EventReview.Data.Auth;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;

namespace EventReview.Cli;

/// <summary>The options every database verb takes (<c>--data DIR</c>, or <c>--connection</c> with <c>--provider</c>) and the services they open.</summary>
public sealed class DataOptions
{
    public Option<string> Data { get; } = new("--data") { Description = "Data folder (SQLite file eventreview.db and attachments). Default: ./data or EventReview__DataDirectory." };

    public Option<string> Connection { get; } = new("--connection") { Description = "Connection string (instead of --data), e.g. a PostgreSQL server. Default: ConnectionStrings__Default." };

    public Option<string> Provider { get; } = new("--provider") { Description = "Sqlite (default) or Postgres, for --connection. Default: Database__Provider." };

    public Option<bool> Json { get; } = new("--json") { Description = "Write the result as camelCase JSON." };

    public void AddTo(Command command)
    {
        command.Options.Add(Data);
        command.Options.Add(Connection);
        command.Options.Add(Provider);
        command.Options.Add(Json);
    }

    /// <summary>The database settings the options name, without opening anything.</summary>
    /// <exception cref="ArgumentException">When the provider is unknown or Postgres has no connection string.</exception>
    public DatabaseSettings Settings(ParseResult parse)
    {
        var data = parse.GetValue(Data) ?? Environment.GetEnvironmentVariable("EventReview__DataDirectory") ?? "./data";
        // Same environment variables as the web app, so that on a server the tool finds the app's database unasked.
        // An explicit --data or --connection always wins over the environment.
        var explicitly = parse.GetValue(Data) is not null || parse.GetValue(Connection) is not null;
        var connection = parse.GetValue(Connection) ?? (explicitly ? null : Environment.GetEnvironmentVariable("ConnectionStrings__Default"));
        var provider = parse.GetValue(Provider) ?? (explicitly ? null : Environment.GetEnvironmentVariable("Database__Provider"));
        return DatabaseSettings.From(provider, connection, data);
    }

    /// <summary>Opens the database (applying migrations) and returns a service provider for it.</summary>
    public async Task<ServiceProvider> OpenAsync(ParseResult parse)
    {
        var settings = Settings(parse);
        var services = new ServiceCollection();
        services.AddLogging(b => b.SetMinimumLevel(LogLevel.Warning));
        services.AddSingleton(TimeProvider.System);
        services.AddEventReviewData(settings);
        services.AddEventReviewIdentityCore();
        var provider = services.BuildServiceProvider();
        await DatabaseInitializer.MigrateAsync(provider.GetRequiredService<AppDbContextFactory>());
        await using var scope = provider.CreateAsyncScope();
        await scope.ServiceProvider.GetRequiredService<AccountAdmin>().EnsureRolesAsync();
        return provider;
    }
}
