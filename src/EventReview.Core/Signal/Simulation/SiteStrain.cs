namespace EventReview.Core.Signal.Simulation;

/// <summary>Simulated strain of one site.</summary>
/// <param name="Code">Site code.</param>
/// <param name="Strain">The series.</param>
public sealed record SiteStrain(string Code, TimeSeries Strain);
