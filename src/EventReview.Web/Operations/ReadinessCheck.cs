using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace EventReview.Web.Operations;

/// <summary>One part of <see cref="HealthProbe"/> as a framework health check: failed is Unhealthy, passed with a warning Degraded.</summary>
public sealed class ReadinessCheck(IServiceScopeFactory scopes, string part) : IHealthCheck
{
    /// <summary>Tag of the checks that make up readiness (liveness runs none).</summary>
    public const string ReadyTag = "ready";

    public async Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        await using var scope = scopes.CreateAsyncScope();
        var line = await scope.ServiceProvider.GetRequiredService<HealthProbe>().CheckAsync(part, cancellationToken);
        return !line.Ok ? new HealthCheckResult(context.Registration.FailureStatus, line.Detail)
            : line.Warning ? HealthCheckResult.Degraded(line.Detail)
            : HealthCheckResult.Healthy(line.Detail);
    }

    /// <summary>Registers every part of the probe, in order, tagged <see cref="ReadyTag"/>.</summary>
    public static IHealthChecksBuilder AddReadinessChecks(IHealthChecksBuilder builder)
    {
        foreach (var part in HealthProbe.Parts)
        {
            builder.AddTypeActivatedCheck<ReadinessCheck>(part, HealthStatus.Unhealthy, [ReadyTag], args: [part]);
        }

        return builder;
    }
}
