using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Data;

public static class DataServiceCollectionExtensions
{
    /// <summary>
    /// Registers the database settings, the context factory and a scoped context (for Identity). With
    /// <paramref name="records"/> (the record key ring and witness) every save signs its chain entries and the verifier
    /// checks signatures and the witness.
    /// </summary>
    public static IServiceCollection AddEventReviewData(this IServiceCollection services, DatabaseSettings settings, Records.RecordKeeping? records = null)
    {
        var factory = new AppDbContextFactory(settings, records);
        services.AddSingleton(settings);
        if (records is not null)
        {
            // Made by a factory, so the container disposes it on shutdown: the witness writes what is still waiting.
            services.AddSingleton(_ => records);
            services.AddSingleton(records.Keys);
        }

        services.AddSingleton(factory);
        services.AddSingleton<IDbContextFactory<AppDbContext>>(factory);
        services.AddScoped(sp => sp.GetRequiredService<IDbContextFactory<AppDbContext>>().CreateDbContext());
        // Group commit on both providers: waiting changes share one transaction and one flush (see BatchingWriteGate).
        services.AddSingleton<Writes.IWriteGate>(_ => new Writes.BatchingWriteGate(factory));
        services.AddSingleton<AttachmentStore>();
        services.AddSingleton(sp => new IntegrityVerifier(factory, sp.GetRequiredService<AttachmentStore>(), settings, records));
        services.AddSingleton<Auth.TokenRevocations>();
        services.AddScoped<Auth.AccountAdmin>();
        services.AddSingleton<Auth.AccountAudit>();
        return services;
    }

    /// <summary>Identity without cookies or UI (the CLI); the web app adds its own sign-in on top.</summary>
    public static IdentityBuilder AddEventReviewIdentityCore(this IServiceCollection services) =>
        services.AddIdentityCore<Auth.AppUser>(ConfigureIdentity)
            .AddRoles<IdentityRole>()
            .AddEntityFrameworkStores<AppDbContext>()
            .AddPasswordValidator<Auth.PasswordRules>();

    /// <summary>Smallest length of a new password.</summary>
    public const int MinPasswordLength = 12;

    /// <summary>
    /// Password and lockout rules shared by every host: at least 12 characters with upper, lower and a digit (plus
    /// <see cref="Auth.PasswordRules"/>); 5 failed sign-ins lock an account for 15 minutes (the web app can change both
    /// lockout numbers under <c>EventReview:Lockout</c>).
    /// </summary>
    public static void ConfigureIdentity(IdentityOptions o)
    {
        o.Password.RequiredLength = MinPasswordLength;
        o.Password.RequireNonAlphanumeric = false;
        o.User.RequireUniqueEmail = true;
        o.Lockout.AllowedForNewUsers = true;
        o.Lockout.MaxFailedAccessAttempts = 5;
        o.Lockout.DefaultLockoutTimeSpan = TimeSpan.FromMinutes(15);
    }
}
