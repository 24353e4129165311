using System.Net;
using EventReview.Data.Telemetry;
using EventReview.Data.Writes;
using OpenTelemetry.Metrics;
using OpenTelemetry.Resources;
using OpenTelemetry.Trace;

namespace EventReview.Web.Operations;

/// <summary>
/// Metrics and traces through OpenTelemetry: <c>/metrics</c> in the Prometheus text format (requests, the writer's
/// meter <see cref="BatchingWriteGate.MeterName"/>, and <see cref="ReviewMetrics"/>), answered only to the addresses
/// of <see cref="TelemetryOptions.MetricsClients"/>; traces of requests over OTLP when an endpoint is configured.
/// </summary>
public static class TelemetrySetup
{
    /// <summary>Path of the Prometheus scrape endpoint.</summary>
    public const string MetricsPath = "/metrics";

    /// <summary>Standard OpenTelemetry variable naming the OTLP endpoint (read by the exporter itself too).</summary>
    public const string StandardOtlpVariable = "OTEL_EXPORTER_OTLP_ENDPOINT";

    public static WebApplicationBuilder AddEventReviewTelemetry(this WebApplicationBuilder builder)
    {
        var section = builder.Configuration.GetSection(TelemetryOptions.Section);
        builder.Services.Configure<TelemetryOptions>(section);
        var options = section.Get<TelemetryOptions>() ?? new TelemetryOptions();
        var allowed = ParseClients(options.MetricsClients);
        builder.Services.AddSingleton(allowed);

        var otel = builder.Services.AddOpenTelemetry()
            .ConfigureResource(r => r.AddService("EventReview"))
            .WithMetrics(m => m
                .AddAspNetCoreInstrumentation()
                .AddMeter(BatchingWriteGate.MeterName, ReviewMetrics.MeterName)
                .AddPrometheusExporter());

        var endpoint = options.OtlpEndpoint is { Length: > 0 } configured ? configured : builder.Configuration[StandardOtlpVariable];
        if (!string.IsNullOrWhiteSpace(endpoint))
        {
            if (!Uri.TryCreate(endpoint, UriKind.Absolute, out var uri))
            {
                throw new ArgumentException($"{TelemetryOptions.Section}:OtlpEndpoint '{endpoint}' is not an absolute address like http://127.0.0.1:4317.", nameof(builder));
            }

            otel.WithTracing(t => t
                .AddAspNetCoreInstrumentation()
                .AddOtlpExporter(o => o.Endpoint = uri));
        }

        return builder;
    }

    /// <summary>
    /// Answers <c>/metrics</c> from any address not allowed with 403 and a problem body; call after the forwarded
    /// headers are applied (<see cref="OperationsSetup.UseEventReviewOperations"/>).
    /// </summary>
    public static WebApplication UseMetricsAccess(this WebApplication app)
    {
        var allowed = app.Services.GetRequiredService<MetricsClients>();
        app.Use((context, next) =>
        {
            if (!context.Request.Path.StartsWithSegments(MetricsPath))
            {
                return next(context);
            }

            // A forwarded-for header still present came through a proxy that is not trusted: its sender is unknown, even
            // when the proxy itself runs on loopback.
            var detail = context.Request.Headers.ContainsKey("X-Forwarded-For")
                ? "The request came through a proxy that is not listed in EventReview:Operations:TrustedProxies, so its client address is unknown."
                : allowed.Allows(context.Connection.RemoteIpAddress)
                    ? null
                    : $"/metrics answers only the addresses listed in {TelemetryOptions.Section}:MetricsClients (default: loopback); " +
                      $"this request came from {context.Connection.RemoteIpAddress?.ToString() ?? "an unknown address"}.";
            return detail is null
                ? next(context)
                : Results.Problem(statusCode: StatusCodes.Status403Forbidden, title: "Metrics not served to this address", detail: detail).ExecuteAsync(context);
        });
        return app;
    }

    /// <summary>Maps <c>/metrics</c> (no sign-in: access is by address, see <see cref="UseMetricsAccess"/>).</summary>
    public static IEndpointRouteBuilder MapMetrics(this IEndpointRouteBuilder app)
    {
        app.MapPrometheusScrapingEndpoint(MetricsPath).AllowAnonymous();
        return app;
    }

    /// <summary>Reads the allowed clients; an entry that is neither an address nor a network stops the start with its name.</summary>
    public static MetricsClients ParseClients(IEnumerable<string> entries)
    {
        var (addresses, networks) = AddressList.Parse(entries, $"{TelemetryOptions.Section}:MetricsClients");
        if (addresses.Count == 0 && networks.Count == 0)
        {
            addresses.AddRange([IPAddress.Loopback, IPAddress.IPv6Loopback]);
        }

        return new MetricsClients(addresses, networks);
    }
}
