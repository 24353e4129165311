using System.Security.Cryptography;

namespace EventReview.Web.Security;

/// <summary>
/// Adds a content security policy, framing protection and no-sniffing to every response. Downloads (<c>/files/*</c>,
/// <c>*/dossier.zip</c>, <c>/network.json</c>) get a sandbox policy instead, so an uploaded HTML or SVG file opened
/// directly can never run script in the app's origin.
/// </summary>
public static class SecurityHeaders
{
    /// <summary>Policy for downloaded files: no script, no plugins, no same-origin rights.</summary>
    public const string DownloadPolicy = "sandbox; default-src 'none'";

    private const string NonceKey = "eventreview:csp-nonce";

    /// <summary>
    /// Policy for pages and the API. Blazor Server needs its own scripts and a WebSocket back to the same host; MudBlazor
    /// sets inline styles, so styles allow 'unsafe-inline' (styles cannot run script). The one inline script, the import
    /// map, carries the per-request nonce.
    /// </summary>
    public static string PagePolicy(string nonce) =>
        "default-src 'self'; " +
        $"script-src 'self' 'nonce-{nonce}'; " +
        "style-src 'self' 'unsafe-inline'; " +
        "img-src 'self' data: blob:; " +
        "font-src 'self' data:; " +
        "connect-src 'self' ws: wss:; " +
        "object-src 'none'; " +
        "base-uri 'self'; " +
        "form-action 'self'; " +
        "frame-ancestors 'none'";

    /// <summary>The nonce of this request's policy (for the import map script tag).</summary>
    public static string Nonce(HttpContext context)
    {
        if (context.Items[NonceKey] is not string nonce)
        {
            nonce = Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(16)); // hex: nothing for HTML to encode
            context.Items[NonceKey] = nonce;
        }

        return nonce;
    }

    /// <summary>True for responses that are file downloads.</summary>
    public static bool IsDownload(PathString path) =>
        path.StartsWithSegments("/files") ||
        path.Equals("/network.json", StringComparison.OrdinalIgnoreCase) ||
        (path.StartsWithSegments("/cases") && path.Value!.EndsWith("/dossier.zip", StringComparison.OrdinalIgnoreCase));

    /// <summary>Adds the headers (set when the response starts, so error pages carry them too).</summary>
    public static IApplicationBuilder UseEventReviewSecurityHeaders(this IApplicationBuilder app) => app.Use(async (context, next) =>
    {
        context.Response.OnStarting(() =>
        {
            var h = context.Response.Headers;
            h.XContentTypeOptions = "nosniff";
            h.XFrameOptions = "DENY";
            h["Referrer-Policy"] = "same-origin";
            h.ContentSecurityPolicy = IsDownload(context.Request.Path) ? DownloadPolicy : PagePolicy(Nonce(context));
            if (context.Request.Path.StartsWithSegments("/files") && context.Response.StatusCode == StatusCodes.Status200OK)
            {
                // Never let a browser render an attachment in our origin, whatever it claims to be.
                h.ContentType = "application/octet-stream";
                if (!h.ContentDisposition.ToString().StartsWith("attachment", StringComparison.OrdinalIgnoreCase))
                {
                    h.ContentDisposition = "attachment";
                }
            }

            return Task.CompletedTask;
        });
        await next(context);
    });
}
