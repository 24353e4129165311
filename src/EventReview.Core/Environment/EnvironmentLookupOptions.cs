namespace EventReview.Core.Environment;

/// <summary>Settings of the environment lookup.</summary>
/// <param name="DefaultWindowSeconds">Half window w around each site's arrival for triggers and segments, seconds (default 1).</param>
/// <param name="WindowSecondsByKind">Half window per sensor kind, overriding the default, or null.</param>
/// <param name="RateWindowSeconds">Length of the window, centred on the arrival, over which each channel's trigger rate is counted (default 3600 s).</param>
/// <param name="LightTravelWindowSeconds">Largest separation of two same-kind triggers at different sites that counts as a cross-site
/// coincidence, seconds (the light-travel time between the sites plus timing uncertainty; default 0.01 s, a continental-baseline rule of thumb).</param>
/// <param name="Coupling">Coupling estimate inputs, or null to skip the estimate.</param>
public sealed record EnvironmentLookupOptions(
    double DefaultWindowSeconds = 1.0,
    IReadOnlyDictionary<SensorKind, double>? WindowSecondsByKind = null,
    double RateWindowSeconds = 3600.0,
    double LightTravelWindowSeconds = 0.01,
    CouplingOptions? Coupling = null)
{
    /// <summary>Half window for a kind, seconds.</summary>
    public double WindowFor(SensorKind kind) =>
        WindowSecondsByKind is not null && WindowSecondsByKind.TryGetValue(kind, out var w) ? w : DefaultWindowSeconds;
}
