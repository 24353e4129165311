using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Data;

public static class DataServiceCollectionExtensions
{
    /// <summary>Registers the database settings, the context factory and a scoped context (for Identity).</summary>
    public static IServiceCollection AddEventReviewData(this IServiceCollection services, DatabaseSettings settings)
    {
        var factory = new AppDbContextFactory(settings);
        services.AddSingleton(settings);
        services.AddSingleton(factory);
        services.AddSingleton<IDbContextFactory<AppDbContext>>(factory);
        services.AddScoped(sp => sp.GetRequiredService<IDbContextFactory<AppDbContext>>().CreateDbContext());
        return services;
    }
}
