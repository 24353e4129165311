namespace EventReview.Core.Signal.Simulation;

/// <summary>Per-site strain and the truth record.</summary>
/// <param name="Sites">One series per site, in the order given.</param>
/// <param name="Truth">What was injected.</param>
public sealed record SimulationResult(IReadOnlyList<SiteStrain> Sites, SimulationTruth Truth);
