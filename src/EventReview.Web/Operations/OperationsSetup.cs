using System.Diagnostics;
using Microsoft.AspNetCore.DataProtection;
using Microsoft.AspNetCore.Diagnostics.HealthChecks;
using Microsoft.AspNetCore.HttpOverrides;
using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace EventReview.Web.Operations;

/// <summary>
/// What a team server needs around the app: JSON logs, trusted reverse proxies, a request id and server time on every
/// response, and the health endpoints (<c>/healthz/live</c>, <c>/healthz/ready</c>).
/// </summary>
public static class OperationsSetup
{
    /// <summary>Response header carrying the request id that every log line of the request also carries.</summary>
    public const string RequestIdHeader = "X-Request-Id";

    public static WebApplicationBuilder AddEventReviewOperations(this WebApplicationBuilder builder)
    {
        var section = builder.Configuration.GetSection(OperationsOptions.Section);
        builder.Services.Configure<OperationsOptions>(section);
        var options = section.Get<OperationsOptions>() ?? new OperationsOptions();
        if (options.JsonLogs ?? !builder.Environment.IsDevelopment())
        {
            builder.Logging.ClearProviders();
            builder.Logging.AddJsonConsole(o =>
            {
                // The hosting layer opens a scope with RequestId/TraceId for every request; scopes go into each line.
                o.IncludeScopes = true;
                o.UseUtcTimestamp = true;
                o.TimestampFormat = "yyyy-MM-ddTHH:mm:ss.fffZ ";
            });
        }

        ThreadPool.GetMinThreads(out var workers, out var io);
        if (options.MinWorkerThreads > workers)
        {
            ThreadPool.SetMinThreads(options.MinWorkerThreads, Math.Max(io, options.MinWorkerThreads));
        }

        builder.Services.Configure<ForwardedHeadersOptions>(o => ConfigureProxies(o, options.TrustedProxies));
        builder.Services.AddScoped<HealthProbe>();
        ReadinessCheck.AddReadinessChecks(builder.Services.AddHealthChecks());

        // Cookie, antiforgery and sign-in state keys live in the database (table DataProtectionKeys), so that sign-ins
        // survive a restart and every app instance on the same database reads the cookies the others made.
        builder.Services.AddDataProtection()
            .PersistKeysToDbContext<EventReview.Data.AppDbContext>()
            .SetApplicationName("EventReview");
        return builder;
    }

    /// <summary>
    /// Trust X-Forwarded-For and X-Forwarded-Proto only from the configured proxies. The framework's default trusts
    /// loopback; that is removed, because any program on the machine (or a local port forward) could then claim any
    /// client address and HTTPS. A proxy on the same host is listed like any other (<c>127.0.0.1</c>, <c>::1</c>).
    /// </summary>
    public static void ConfigureProxies(ForwardedHeadersOptions o, IEnumerable<string> trusted)
    {
        o.ForwardLimit = 1;
        o.KnownProxies.Clear();
        o.KnownIPNetworks.Clear();

        // With both lists empty the framework would believe every sender: read no forwarded header at all instead.
        o.ForwardedHeaders = ForwardedHeaders.None;
        var (addresses, networks) = AddressList.Parse(trusted, "EventReview:Operations:TrustedProxies");
        addresses.ForEach(o.KnownProxies.Add);
        networks.ForEach(o.KnownIPNetworks.Add);
        if (addresses.Count + networks.Count > 0)
        {
            o.ForwardedHeaders = ForwardedHeaders.XForwardedFor | ForwardedHeaders.XForwardedProto;
        }
    }

    /// <summary>First in the pipeline: proxy headers, then the request id and server time headers, then the HTTPS rule.</summary>
    public static WebApplication UseEventReviewOperations(this WebApplication app)
    {
        app.UseForwardedHeaders();
        var requireHttps = app.Services.GetRequiredService<Microsoft.Extensions.Options.IOptions<OperationsOptions>>().Value.RequireHttps ?? !app.Environment.IsDevelopment();
        app.Use(static (context, next) =>
        {
            var started = Stopwatch.GetTimestamp();
            context.Response.OnStarting(static state =>
            {
                var (ctx, t0) = ((HttpContext, long))state;
                ctx.Response.Headers[RequestIdHeader] = ctx.TraceIdentifier;
                var ms = Stopwatch.GetElapsedTime(t0).TotalMilliseconds;
                ctx.Response.Headers["Server-Timing"] = $"app;dur={ms.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture)}";
                return Task.CompletedTask;
            }, (context, started));
            return next(context);
        });
        if (requireHttps)
        {
            app.Use(static (context, next) => context.Request.IsHttps || IsMachinePath(context.Request.Path) ? next(context) : HttpsRequiredAsync(context));
        }

        return app;
    }

    private static bool IsMachinePath(PathString path) =>
        path.StartsWithSegments("/api") || path.StartsWithSegments("/openapi") || path.StartsWithSegments("/healthz") ||
        path.StartsWithSegments(TelemetrySetup.MetricsPath);

    private static Task HttpsRequiredAsync(HttpContext context)
    {
        context.Response.StatusCode = StatusCodes.Status400BadRequest;
        context.Response.ContentType = "text/html; charset=utf-8";
        return context.Response.WriteAsync("""
            <!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><title>HTTPS needed · EventReview</title></head>
            <body style="font-family: sans-serif; max-width: 40rem; margin: 3rem auto; line-height: 1.5">
            <h1>This EventReview server must be reached over HTTPS</h1>
            <p>The request arrived over plain HTTP. Sign-in cookies on a team server are sent only over HTTPS, so the pages
            cannot work this way. Open the server's https:// address. If you run the server: put it behind the reverse proxy
            of the operations guide (docs/operations.md), which terminates HTTPS and sends <code>X-Forwarded-Proto: https</code>,
            and list the proxy's address in <code>EventReview:Operations:TrustedProxies</code> (also when it runs on this machine: <code>127.0.0.1</code>).</p>
            <p>The API (<code>/api</code>), <code>/healthz</code> and <code>/metrics</code> still answer over HTTP for tools on the server itself.</p>
            </body></html>
            """);
    }

    /// <summary>
    /// Without sign-in: <c>GET /healthz/live</c> (the process answers: runs no check, 200) and <c>GET /healthz/ready</c>
    /// (every part of <see cref="HealthProbe"/>: 200 "ok" or "degraded", 503 "failing" naming the part); <c>/healthz</c>
    /// is the same as ready.
    /// </summary>
    public static IEndpointRouteBuilder MapHealth(this IEndpointRouteBuilder app)
    {
        app.MapHealthChecks("/healthz/live", new HealthCheckOptions
        {
            Predicate = _ => false,
            ResponseWriter = static (http, _) => http.Response.WriteAsJsonAsync(new { status = "ok", detail = "The process answers." }),
        }).AllowAnonymous();
        foreach (var path in (string[])["/healthz/ready", "/healthz"])
        {
            app.MapHealthChecks(path, new HealthCheckOptions
            {
                Predicate = r => r.Tags.Contains(ReadinessCheck.ReadyTag),
                ResultStatusCodes =
                {
                    [HealthStatus.Healthy] = StatusCodes.Status200OK,
                    [HealthStatus.Degraded] = StatusCodes.Status200OK,
                    [HealthStatus.Unhealthy] = StatusCodes.Status503ServiceUnavailable,
                },
                ResponseWriter = static (http, report) => http.Response.WriteAsJsonAsync(HealthReport.From(report)),
            }).AllowAnonymous();
        }

        return app;
    }
}
