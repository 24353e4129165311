using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Identity;

namespace EventReview.Web.Security;

/// <summary>
/// Refuses requests a browser sends on the signed-in user's behalf from another origin. The sign-in cookie is
/// <c>SameSite=Lax</c>, and "same site" ignores the port, so a page on the same host under another port (or another
/// sub-domain of the site) can make the browser send it. Therefore:
/// <list type="bullet">
/// <item>an unsafe request (POST, PUT, PATCH, DELETE) or a WebSocket handshake whose <c>Origin</c> header names another
/// origin (scheme, host and port) is refused, unless it is authenticated by an API token (a browser never adds one on
/// its own);</item>
/// <item>an unsafe API request authenticated by the cookie and without an <c>Origin</c> header must carry the
/// antiforgery token (header <c>RequestVerificationToken</c>), as the app's own forms do.</item>
/// </list>
/// Refusals are 403 problems and change nothing. Requests with an API token, and safe requests, pass untouched.
/// </summary>
public static class CrossSiteRequestGuard
{
    /// <summary>The problem's <c>rule</c> for a refused cross-origin request.</summary>
    public const string Rule = "same-origin";

    /// <summary>Adds the guard; call after authentication (it needs to know how the caller signed in).</summary>
    public static IApplicationBuilder UseCrossSiteRequestGuard(this IApplicationBuilder app) => app.Use(async (context, next) =>
    {
        var request = context.Request;
        var unsafeMethod = !(HttpMethods.IsGet(request.Method) || HttpMethods.IsHead(request.Method) || HttpMethods.IsOptions(request.Method) || HttpMethods.IsTrace(request.Method));
        if ((!unsafeMethod && !context.WebSockets.IsWebSocketRequest) || ByToken(context))
        {
            await next(context);
            return;
        }

        var origin = request.Headers.Origin.ToString();
        if (origin.Length > 0)
        {
            if (!IsOwnOrigin(request, origin))
            {
                await RefuseAsync(context, $"This request came from a page of another origin ({Shown(origin)}), not from {OwnOrigin(request)}; requests made with your sign-in must come from the app's own pages. Nothing was changed.");
                return;
            }
        }
        else if (request.Path.StartsWithSegments("/api") && ByCookie(context) &&
                 !await context.RequestServices.GetRequiredService<IAntiforgery>().IsRequestValidAsync(context))
        {
            await RefuseAsync(context, "A signed-in browser's API write needs the antiforgery token (header 'RequestVerificationToken') or an Origin header of this site; tools should use an API token. Nothing was changed.");
            return;
        }

        await next(context);
    });

    /// <summary>This request's own origin as a browser writes it: <c>scheme://host[:port]</c> (after trusted forwarded headers).</summary>
    public static string OwnOrigin(HttpRequest request) => $"{request.Scheme}://{request.Host.Value}".ToLowerInvariant();

    /// <summary>True when <paramref name="origin"/> (an Origin header) is this request's own origin; "null" and malformed values never are.</summary>
    public static bool IsOwnOrigin(HttpRequest request, string origin)
    {
        if (!Uri.TryCreate(origin, UriKind.Absolute, out var uri) || uri.AbsolutePath != "/" || uri.Query.Length > 0 || uri.UserInfo.Length > 0)
        {
            return false;
        }

        var host = request.Host;
        var ownPort = host.Port ?? (string.Equals(request.Scheme, "https", StringComparison.OrdinalIgnoreCase) ? 443 : 80);
        return string.Equals(uri.Scheme, request.Scheme, StringComparison.OrdinalIgnoreCase) &&
               string.Equals(uri.IdnHost, host.Host, StringComparison.OrdinalIgnoreCase) &&
               uri.Port == ownPort;
    }

    private static bool ByToken(HttpContext context) => context.User.Identity is { IsAuthenticated: true, AuthenticationType: Auth.ApiTokenAuthenticationHandler.SchemeName };

    private static bool ByCookie(HttpContext context) => context.User.Identity is { IsAuthenticated: true, AuthenticationType: var type } && type == IdentityConstants.ApplicationScheme;

    private static string Shown(string origin) => origin.Length <= 80 ? origin : origin[..80] + "...";

    private static Task RefuseAsync(HttpContext context, string detail) =>
        Api.ApiResults.Problem(StatusCodes.Status403Forbidden, "Cross-origin request refused", detail, rule: Rule).ExecuteAsync(context);
}
