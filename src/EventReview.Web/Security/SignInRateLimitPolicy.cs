using System.Threading.RateLimiting;
using Microsoft.AspNetCore.RateLimiting;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Security;

/// <summary>Limits sign-in form posts per client address (fixed one-minute window), whatever the email typed.</summary>
public sealed class SignInRateLimitPolicy(IOptions<RateLimitSettings> options) : IRateLimiterPolicy<string>
{
    public const string Name = "signin";

    private readonly RateLimitSettings _settings = options.Value;

    public Func<OnRejectedContext, CancellationToken, ValueTask>? OnRejected => (ctx, _) => TooManyRequests.SignInAsync(ctx, 60);

    public RateLimitPartition<string> GetPartition(HttpContext httpContext) => !_settings.Enabled
        ? RateLimitPartition.GetNoLimiter("off")
        : RateLimitPartition.GetFixedWindowLimiter("signin:" + ClientAddress.Of(httpContext), _ => new FixedWindowRateLimiterOptions
        {
            PermitLimit = Math.Max(1, _settings.SignInPerMinute),
            Window = TimeSpan.FromMinutes(1),
            QueueLimit = 0,
        });
}
