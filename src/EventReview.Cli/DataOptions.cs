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

    public Option<string> Keys { get; } = new("--keys") { Description = "Record key folder. Default: EventReview__Records__KeyDirectory, else keys/ in the data folder." };

    public Option<string> Witness { get; } = new("--witness") { Description = "Witness folder. Default: EventReview__Records__WitnessDirectory, else witness/ in the data folder." };

    public void AddTo(Command command)
    {
        command.Options.Add(Data);
        command.Options.Add(Connection);
        command.Options.Add(Provider);
        command.Options.Add(Json);
        command.Options.Add(Keys);
        command.Options.Add(Witness);
    }

    /// <summary>Where the record key and the witness are (options, then the app's environment variables, then the data folder).</summary>
    public EventReview.Data.Records.RecordSettings RecordSettings(ParseResult parse) =>
        EventReview.Data.Records.RecordSettings.FromEnvironment(Settings(parse).DataDirectory, parse.GetValue(Keys), parse.GetValue(Witness));

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

    /// <summary>
    /// Opens the database (applying migrations) with the record key and witness, and returns a service provider for it.
    /// A verb that writes (<paramref name="writes"/>) first makes sure the key can sign (creating the first key of a new
    /// installation); a verb that only reads never creates a key.
    /// </summary>
    public async Task<ServiceProvider> OpenAsync(ParseResult parse, bool writes = true)
    {
        var settings = Settings(parse);
        var services = new ServiceCollection();
        services.AddLogging(b => b.SetMinimumLevel(LogLevel.Warning));
        services.AddSingleton(TimeProvider.System);
        services.AddEventReviewData(settings, EventReview.Data.Records.RecordKeeping.Open(RecordSettings(parse)));
        services.AddEventReviewIdentityCore();
        var provider = services.BuildServiceProvider();
        await DatabaseInitializer.MigrateAsync(provider.GetRequiredService<AppDbContextFactory>());
        if (writes)
        {
            await EventReview.Data.Records.RecordKeyStartup.EnsureSigningKeyAsync(provider.GetRequiredService<AppDbContextFactory>(), TimeProvider.System);
        }

        await using var scope = provider.CreateAsyncScope();
        await scope.ServiceProvider.GetRequiredService<AccountAdmin>().EnsureRolesAsync();
        return provider;
    }
}
