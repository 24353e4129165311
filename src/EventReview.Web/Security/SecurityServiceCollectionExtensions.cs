using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Authentication.Cookies;
using Microsoft.AspNetCore.Identity;

namespace EventReview.Web.Security;

public static class SecurityServiceCollectionExtensions
{
    /// <summary>
    /// Rate limits (<see cref="RateLimitSettings"/>), lockout numbers from <c>EventReview:Lockout</c>, and cookie flags:
    /// HttpOnly, SameSite=Lax, Secure always outside Development (same as the request in Development and tests).
    /// </summary>
    public static IServiceCollection AddEventReviewSecurity(this IServiceCollection services, IConfiguration configuration)
    {
        services.Configure<RateLimitSettings>(configuration.GetSection(RateLimitSettings.Section));
        services.AddRateLimiter(o =>
        {
            o.RejectionStatusCode = StatusCodes.Status429TooManyRequests;
            o.AddPolicy<string, ApiRateLimitPolicy>(ApiRateLimitPolicy.Name);
            o.AddPolicy<string, SignInRateLimitPolicy>(SignInRateLimitPolicy.Name);
        });

        services.Configure<IdentityOptions>(o =>
        {
            o.Lockout.MaxFailedAccessAttempts = configuration.GetValue<int?>("EventReview:Lockout:MaxFailedAttempts") ?? o.Lockout.MaxFailedAccessAttempts;
            o.Lockout.DefaultLockoutTimeSpan = TimeSpan.FromMinutes(configuration.GetValue<double?>("EventReview:Lockout:Minutes") ?? o.Lockout.DefaultLockoutTimeSpan.TotalMinutes);
        });

        services.AddOptions<CookieAuthenticationOptions>(IdentityConstants.ApplicationScheme).Configure<IWebHostEnvironment>((o, env) =>
        {
            o.Cookie.HttpOnly = true;
            o.Cookie.SameSite = SameSiteMode.Lax;
            o.Cookie.SecurePolicy = SecurePolicy(env);
        });
        services.AddOptions<AntiforgeryOptions>().Configure<IWebHostEnvironment>((o, env) =>
        {
            o.Cookie.HttpOnly = true;
            o.Cookie.SameSite = SameSiteMode.Strict;
            o.Cookie.SecurePolicy = SecurePolicy(env);
        });
        return services;
    }

    private static CookieSecurePolicy SecurePolicy(IWebHostEnvironment env) =>
        env.IsDevelopment() ? CookieSecurePolicy.SameAsRequest : CookieSecurePolicy.Always;
}
