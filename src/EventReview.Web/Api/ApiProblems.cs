using Microsoft.AspNetCore.Diagnostics;

namespace EventReview.Web.Api;

/// <summary>
/// Every error answer of the machine-facing paths (the API, <c>/openapi</c>, downloads, the sign-in and sign-out form
/// posts) is an RFC 9457 problem (<c>application/problem+json</c>) saying what was wrong, never an empty body or an HTML
/// page: answers without a body get one here, unexpected exceptions become a 500 problem, and the router's own
/// refusals (a method or media type no endpoint takes) are answered before sign-in is checked, so they are 405 and 415
/// rather than a misleading 401 or 403.
/// </summary>
public static class ApiProblems
{
    /// <summary>True for the paths whose errors are JSON problems (pages keep their HTML error pages).</summary>
    public static bool IsProblemPath(PathString path) =>
        path.StartsWithSegments("/api") || path.StartsWithSegments("/openapi") || path.StartsWithSegments("/account") ||
        path.StartsWithSegments("/healthz") || path.StartsWithSegments("/metrics") || Security.SecurityHeaders.IsDownload(path);

    /// <summary>Adds the problem answers for <see cref="IsProblemPath"/>; call before authentication.</summary>
    public static WebApplication UseApiProblems(this WebApplication app)
    {
        app.UseWhen(ctx => IsProblemPath(ctx.Request.Path), branch =>
        {
            branch.UseExceptionHandler(new ExceptionHandlerOptions
            {
                ExceptionHandler = WriteExceptionAsync,

                // A request the framework could not read is the caller's mistake, answered 4xx: not logged as a server error.
                SuppressDiagnosticsCallback = c => c.Exception is BadHttpRequestException,
            });
            branch.UseStatusCodePages(new StatusCodePagesOptions { HandleAsync = ctx => WriteStatusAsync(ctx.HttpContext) });
            branch.Use(static (context, next) =>
            {
                var endpoint = context.GetEndpoint();
                if (endpoint is null)
                {
                    // No such endpoint: say so to every caller alike (the paths are documented), not "sign in first".
                    context.Response.StatusCode = StatusCodes.Status404NotFound;
                    return Task.CompletedTask;
                }

                return IsRouterRefusal(endpoint) ? endpoint.RequestDelegate!(context) : next(context);
            });
        });
        return app;
    }

    // The router answers a known path with an unsupported method or media type through endpoints of its own, which carry
    // no policy of ours; run them at once (the status pages above add the body).
    private static bool IsRouterRefusal(Endpoint endpoint) =>
        endpoint.DisplayName is "405 HTTP Method Not Supported" or "415 HTTP Unsupported Media Type" && endpoint.RequestDelegate is not null;

    private static Task WriteStatusAsync(HttpContext http)
    {
        var status = http.Response.StatusCode;
        var (title, detail) = status switch
        {
            StatusCodes.Status400BadRequest => ("Malformed request", "The request could not be read (its form, query or body is malformed); nothing was changed."),
            StatusCodes.Status401Unauthorized => ("Not signed in", "Sign in, or send a valid API token as 'Authorization: Bearer ert_...'."),
            StatusCodes.Status403Forbidden => ("Not allowed", "Your role or your token's scopes do not allow this request; nothing was changed."),
            StatusCodes.Status404NotFound => ("Not found", $"There is nothing at {http.Request.Path}."),
            StatusCodes.Status405MethodNotAllowed => ("Method not allowed", $"{http.Request.Method} is not supported here" +
                (http.Response.Headers.Allow.Count > 0 ? $"; use {http.Response.Headers.Allow}." : ".")),
            StatusCodes.Status413PayloadTooLarge => ("Request too large", "The request body is larger than the server accepts; nothing was stored."),
            StatusCodes.Status415UnsupportedMediaType => ("Unsupported media type",
                $"'{http.Request.ContentType}' is not accepted here: send JSON as application/json and files as multipart/form-data."),
            _ => (ReasonPhrase(status), $"The request was refused ({status}); nothing was changed."),
        };
        return ApiResults.Problem(status, title, detail).ExecuteAsync(http);
    }

    private static Task WriteExceptionAsync(HttpContext http)
    {
        var error = http.Features.Get<IExceptionHandlerFeature>()?.Error;
        if (error is BadHttpRequestException bad)
        {
            // The framework's own refusals of a request it could not read (a query value of the wrong type, a form too
            // large): their message names the parameter.
            return ApiResults.Problem(bad.StatusCode, bad.StatusCode == StatusCodes.Status413PayloadTooLarge ? "Request too large" : "Malformed request",
                bad.Message).ExecuteAsync(http);
        }

        return ApiResults.Problem(StatusCodes.Status500InternalServerError, "Unexpected error",
            $"The server failed on this request (request id {http.TraceIdentifier}); the failure is logged. Nothing acknowledged is lost.").ExecuteAsync(http);
    }

    private static string ReasonPhrase(int status) => Microsoft.AspNetCore.WebUtilities.ReasonPhrases.GetReasonPhrase(status) is { Length: > 0 } p ? p : "Error";
}
