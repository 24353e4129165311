using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Timing;

namespace EventReview.Core.Antenna;

/// <summary>Runs <see cref="AntennaConsistency"/> on the directions a timing check allows for one pair of sites.</summary>
public static class AntennaCheck
{
    /// <summary>
    /// Directions used: the sky solutions of <paramref name="timing"/> when it has any (three or more sites), otherwise
    /// <paramref name="ringSamples"/> directions on the ring of the pair (a, b) in either order. A pair whose |c Δt / d| exceeds 1 is
    /// evaluated on its clamped ring (the baseline direction) so that a result within the timing tolerance can still be judged.
    /// </summary>
    /// <exception cref="ArgumentException">When a site code is unknown or the pair is not in the timing result.</exception>
    public static AntennaConsistencyResult ForPair(IReadOnlyList<Site> sites, TimingCheckResult timing, string a, string b,
        AntennaObservation observation, AntennaConsistencyOptions? options = null, int ringSamples = 72)
    {
        ArgumentNullException.ThrowIfNull(sites);
        ArgumentNullException.ThrowIfNull(timing);
        var siteA = sites.FirstOrDefault(s => string.Equals(s.Code, a, StringComparison.OrdinalIgnoreCase))
            ?? throw new ArgumentException($"Unknown site code '{a}'.", nameof(a));
        var siteB = sites.FirstOrDefault(s => string.Equals(s.Code, b, StringComparison.OrdinalIgnoreCase))
            ?? throw new ArgumentException($"Unknown site code '{b}'.", nameof(b));
        IReadOnlyList<Vector3> directions;
        if (timing.Sky.Count > 0)
        {
            directions = timing.Sky.Select(s => s.Direction).ToArray();
        }
        else
        {
            var pair = timing.Pairs.FirstOrDefault(p => (p.A == siteA.Code && p.B == siteB.Code) || (p.A == siteB.Code && p.B == siteA.Code))
                ?? throw new ArgumentException($"The timing result has no pair {a}-{b}.", nameof(b));
            var axis = Baseline.Between(sites.First(s => s.Code == pair.A), sites.First(s => s.Code == pair.B)).VectorMeters;
            directions = SkyRing.Directions(axis, pair.RingCosine, ringSamples);
        }

        return AntennaConsistency.Evaluate(siteA, siteB, directions, observation, options);
    }
}
