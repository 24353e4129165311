namespace EventReview.Core.Signal.Simulation;

/// <summary>How the wave reaches one site, computed by the caller from the network geometry.</summary>
/// <param name="Code">Site code (e.g. "KX").</param>
/// <param name="DelaySeconds">Arrival time at the site minus the reference coalescence time, seconds.</param>
/// <param name="FPlus">Antenna response to the plus polarisation.</param>
/// <param name="FCross">Antenna response to the cross polarisation.</param>
public sealed record SiteProjection(string Code, double DelaySeconds, double FPlus, double FCross);
