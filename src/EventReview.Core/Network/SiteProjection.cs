namespace EventReview.Core.Network;

/// <summary>
/// How one site sees a plane wave: arrival delay relative to the geocentre (seconds, t_site - t_geocentre = -n·r/c)
/// and the antenna pattern values F+ and F× (dimensionless) at the given polarisation angle.
/// </summary>
public sealed record SiteProjection(string Code, double DelaySeconds, double FPlus, double FCross);
