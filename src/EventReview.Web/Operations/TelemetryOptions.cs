namespace EventReview.Web.Operations;

/// <summary>Settings under <c>EventReview:Telemetry</c>.</summary>
public sealed class TelemetryOptions
{
    public const string Section = "EventReview:Telemetry";

    /// <summary>
    /// Client addresses or networks (<c>10.0.0.0/8</c>) allowed to read <c>/metrics</c> (default: none listed, which
    /// means loopback only: <c>127.0.0.1</c> and <c>::1</c>). Behind a reverse proxy listed in
    /// <c>EventReview:Operations:TrustedProxies</c> the address is the one the proxy forwards.
    /// </summary>
    public string[] MetricsClients { get; set; } = [];

    /// <summary>
    /// OTLP endpoint that receives traces (e.g. <c>http://127.0.0.1:4317</c>); without it (and without the standard
    /// <c>OTEL_EXPORTER_OTLP_ENDPOINT</c> variable) no trace is exported.
    /// </summary>
    public string? OtlpEndpoint { get; set; }
}
