using System.Globalization;
using System.Threading.RateLimiting;
using Microsoft.AspNetCore.RateLimiting;

namespace EventReview.Web.Security;

/// <summary>The answers to a refused request: a problem (API) or a short page (sign-in form), both 429 with Retry-After.</summary>
public static class TooManyRequests
{
    /// <summary>Seconds to wait, from the limiter when it knows, else <paramref name="fallbackSeconds"/>.</summary>
    public static int RetryAfterSeconds(OnRejectedContext context, int fallbackSeconds) =>
        context.Lease.TryGetMetadata(MetadataName.RetryAfter, out var wait) ? Math.Max(1, (int)Math.Ceiling(wait.TotalSeconds)) : fallbackSeconds;

    public static ValueTask ApiAsync(OnRejectedContext context, int fallbackSeconds, string who)
    {
        var seconds = RetryAfterSeconds(context, fallbackSeconds);
        var http = context.HttpContext;
        http.Response.StatusCode = StatusCodes.Status429TooManyRequests;
        http.Response.Headers.RetryAfter = seconds.ToString(CultureInfo.InvariantCulture);
        var result = Results.Problem(
            detail: $"Too many requests from {who}; wait {seconds} s and try again. Nothing was changed by this request.",
            statusCode: StatusCodes.Status429TooManyRequests,
            title: "Too many requests",
            extensions: new Dictionary<string, object?> { ["retryAfterSeconds"] = seconds });
        return new ValueTask(result.ExecuteAsync(http));
    }

    public static ValueTask SignInAsync(OnRejectedContext context, int fallbackSeconds)
    {
        var seconds = RetryAfterSeconds(context, fallbackSeconds);
        var http = context.HttpContext;
        http.Response.StatusCode = StatusCodes.Status429TooManyRequests;
        http.Response.Headers.RetryAfter = seconds.ToString(CultureInfo.InvariantCulture);
        var html = $"""
            <!DOCTYPE html>
            <html lang="en"><head><meta charset="utf-8"><title>Too many sign-in attempts · EventReview</title></head>
            <body><main><h1>Too many sign-in attempts</h1>
            <p role="alert">Too many sign-in attempts from your address. Wait {seconds} seconds, then <a href="/signin">try again</a>.</p>
            </main></body></html>
            """;
        return new ValueTask(Results.Content(html, "text/html; charset=utf-8", statusCode: StatusCodes.Status429TooManyRequests).ExecuteAsync(http));
    }
}
