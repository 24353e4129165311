using EventReview.Core.Geodesy;
using EventReview.Core.Network;

namespace EventReview.Core.Environment;

/// <summary>The cross-site coincidence window of the environment lookup taken from a network: the largest light-travel time between the sites.</summary>
public static class CrossSiteWindow
{
    /// <summary>Where a window taken from the network comes from, in words.</summary>
    public const string NetworkSource = "network (largest light-travel time between the case's sites)";

    /// <summary>
    /// The window, seconds (rounded to 1 µs), and where it came from: <paramref name="given"/> when set ("given"), else the
    /// largest light-travel time between any two of <paramref name="codes"/> found in <paramref name="sites"/>.
    /// </summary>
    /// <exception cref="ArgumentException">When no window is given and two or more codes are asked for but fewer than two are in the network.</exception>
    public static (double Seconds, string Source) Choose(IReadOnlyList<Site> sites, IEnumerable<string> codes, double? given)
    {
        ArgumentNullException.ThrowIfNull(sites);
        ArgumentNullException.ThrowIfNull(codes);
        if (given is { } g)
        {
            return (g, "given");
        }

        var wanted = codes.Select(c => c.ToUpperInvariant()).ToHashSet(StringComparer.Ordinal);
        if (wanted.Count < 2)
        {
            return (0, "one site: no cross-site coincidence is possible");
        }

        var used = sites.Where(s => wanted.Contains(s.Code.ToUpperInvariant())).ToList();
        if (used.Count < 2)
        {
            throw new ArgumentException($"Fewer than two of the sites ({string.Join(", ", wanted.Order(StringComparer.Ordinal))}) are in the network, so the cross-site window cannot be derived; give it in seconds.", nameof(codes));
        }

        var max = 0.0;
        for (var i = 0; i < used.Count; i++)
        {
            for (var j = i + 1; j < used.Count; j++)
            {
                max = Math.Max(max, Baseline.Between(used[i], used[j]).LightTravelSeconds);
            }
        }

        return (Math.Round(max, 6), NetworkSource);
    }
}
