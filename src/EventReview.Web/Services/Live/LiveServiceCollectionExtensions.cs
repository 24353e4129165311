using EventReview.Data;

namespace EventReview.Web.Services.Live;

public static class LiveServiceCollectionExtensions
{
    /// <summary>
    /// The live case feed: the in-process bus always; on PostgreSQL also the relay to the other instances on the same
    /// database (channel <c>EventReview:Live:Channel</c>, default <see cref="PostgresLiveRelay.DefaultChannel"/>).
    /// SQLite is one instance, so the bus alone serves it.
    /// </summary>
    public static IServiceCollection AddEventReviewLive(this IServiceCollection services, IConfiguration configuration, DatabaseSettings settings)
    {
        services.AddSingleton(sp => new CaseBus(sp.GetRequiredService<TimeProvider>(), sp.GetRequiredService<ILogger<CaseBus>>(),
            sp.GetRequiredService<AppDbContextFactory>().Records));
        if (settings.Provider == DatabaseProvider.Postgres)
        {
            var channel = PostgresLiveRelay.ValidChannel(configuration["EventReview:Live:Channel"] ?? PostgresLiveRelay.DefaultChannel);
            services.AddSingleton(sp => new PostgresLiveRelay(sp.GetRequiredService<CaseBus>(), settings.ConnectionString, channel,
                sp.GetRequiredService<ILogger<PostgresLiveRelay>>()));
            services.AddHostedService(sp => sp.GetRequiredService<PostgresLiveRelay>());
        }

        return services;
    }
}
