using System.Security.Claims;
using System.Threading.RateLimiting;
using EventReview.Web.Auth;
using Microsoft.AspNetCore.RateLimiting;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Security;

/// <summary>
/// Limits the API and downloads: a request with a valid API token counts against that token (token bucket); any other
/// request (a person's browser, no token, a refused token) counts against the client address (fixed one-minute window).
/// </summary>
public sealed class ApiRateLimitPolicy(IOptions<RateLimitSettings> options) : IRateLimiterPolicy<string>
{
    public const string Name = "api";

    private readonly RateLimitSettings _settings = options.Value;

    public Func<OnRejectedContext, CancellationToken, ValueTask>? OnRejected => (ctx, _) =>
        TooManyRequests.ApiAsync(ctx, 1, ctx.HttpContext.User.FindFirstValue(UserClaims.TokenId) is { } id ? $"API token {id}" : "your address");

    public RateLimitPartition<string> GetPartition(HttpContext httpContext)
    {
        if (!_settings.Enabled)
        {
            return RateLimitPartition.GetNoLimiter("off");
        }

        if (httpContext.User.FindFirstValue(UserClaims.TokenId) is { } tokenId)
        {
            return RateLimitPartition.GetTokenBucketLimiter("token:" + tokenId, _ => new TokenBucketRateLimiterOptions
            {
                TokenLimit = Math.Max(1, _settings.TokenBurst),
                TokensPerPeriod = Math.Max(1, _settings.TokenPerSecond),
                ReplenishmentPeriod = TimeSpan.FromSeconds(1),
                QueueLimit = 0,
                AutoReplenishment = true,
            });
        }

        return RateLimitPartition.GetFixedWindowLimiter("address:" + ClientAddress.Of(httpContext), _ => new FixedWindowRateLimiterOptions
        {
            PermitLimit = Math.Max(1, _settings.AddressPerMinute),
            Window = TimeSpan.FromMinutes(1),
            QueueLimit = 0,
        });
    }
}
