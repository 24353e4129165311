using EventReview.Core.Antenna;
using EventReview.Core.Geodesy;

namespace EventReview.Core.Network;

/// <summary>Projects a plane wave from one direction onto every site of a network (for simulators and checks).</summary>
public static class NetworkProjection
{
    /// <summary>
    /// For a source in ECEF direction n (toward the source, any non-zero length) and polarisation angle ψ (radians, convention of
    /// <see cref="AntennaPattern"/>): each site's delay t = t0 - n·r/c relative to the geocentre arrival t0, and its F+, F×.
    /// The direction is Earth-fixed: convert RA/Dec with <see cref="Time.SkyFrame.ToEcef"/> at the event's GMST first.
    /// </summary>
    public static IReadOnlyList<SiteProjection> Project(IReadOnlyList<Site> sites, Vector3 direction, double psiRadians)
    {
        ArgumentNullException.ThrowIfNull(sites);
        if (!direction.IsFinite || direction.Length == 0)
        {
            throw new ArgumentException("Direction must be a finite non-zero vector.", nameof(direction));
        }

        var n = direction.Normalized();
        var result = new List<SiteProjection>(sites.Count);
        foreach (var site in sites)
        {
            var r = SiteGeometry.Position(site);
            var delay = -Vector3.Dot(n, r) / PhysicalConstants.SpeedOfLightMetersPerSecond;
            var f = AntennaPattern.Response(SiteGeometry.Tensor(site), n, psiRadians);
            result.Add(new SiteProjection(site.Code, delay, f.FPlus, f.FCross));
        }

        return result;
    }
}
