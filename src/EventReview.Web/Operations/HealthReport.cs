using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace EventReview.Web.Operations;

/// <summary>Body of <c>GET /healthz/ready</c> (and <c>/healthz</c>): overall status and one line per part checked.</summary>
/// <param name="Status">"ok" when every part passed, "degraded" when every part passed but some with a warning, otherwise "failing".</param>
/// <param name="Checks">Each part checked, in a fixed order (<see cref="HealthProbe.Parts"/>).</param>
public sealed record HealthReport(string Status, IReadOnlyList<HealthCheckLine> Checks)
{
    [System.Text.Json.Serialization.JsonIgnore]
    public bool Healthy => Checks.All(c => c.Ok);

    /// <summary>The body for the framework's report of the readiness checks.</summary>
    public static HealthReport From(Microsoft.Extensions.Diagnostics.HealthChecks.HealthReport report)
    {
        var lines = report.Entries.OrderBy(e => Array.IndexOf(HealthProbe.Parts, e.Key)).Select(e => new HealthCheckLine(e.Key,
            e.Value.Status != HealthStatus.Unhealthy, e.Value.Description ?? e.Value.Exception?.GetType().Name ?? "no detail", e.Value.Status == HealthStatus.Degraded)).ToList();
        var status = report.Status switch { HealthStatus.Healthy => "ok", HealthStatus.Degraded => "degraded", _ => "failing" };
        return new HealthReport(status, lines);
    }
}

/// <summary>One part of the health report.</summary>
/// <param name="Name">database, migrations, attachments, leap-seconds, record-key or witness.</param>
/// <param name="Ok">Whether it passed.</param>
/// <param name="Detail">What was found, in words (never a secret or a connection string).</param>
/// <param name="Warning">Passed, but something should be changed (the detail says what): the server is degraded, not failing.</param>
public sealed record HealthCheckLine(string Name, bool Ok, string Detail, bool Warning = false);
