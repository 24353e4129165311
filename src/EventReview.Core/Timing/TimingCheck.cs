using System.Globalization;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Time;

namespace EventReview.Core.Timing;

/// <summary>
/// Cross-site timing check: for every pair of sites with an arrival, the observed difference against the light-travel time plus
/// k × sqrt(σa² + σb²); the sky ring of each pair (cos θ = c Δt / d about r_a - r_b); and, for three or more sites, the source
/// directions that fit all arrivals (see <see cref="SkySolver"/>). Deterministic: the same input gives the same result.
/// </summary>
public static class TimingCheck
{
    /// <summary>Runs the check. Pairs are formed in the order of <paramref name="arrivals"/> (a before b).</summary>
    /// <exception cref="ArgumentException">Naming the field or site code: fewer than two arrivals, unknown or duplicate site code,
    /// duplicate site codes in <paramref name="sites"/>, non-finite SNR or k, or arrivals spread beyond the guard.</exception>
    public static TimingCheckResult Run(IReadOnlyList<Site> sites, IReadOnlyList<SiteArrival> arrivals, TimingOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(sites);
        ArgumentNullException.ThrowIfNull(arrivals);
        options ??= TimingOptions.Default;
        var used = Validate(sites, arrivals, options);
        var k = options.KSigma;
        var table = LeapSecondTable.Bundled;

        var pairs = new List<PairTiming>();
        for (var i = 0; i < used.Count; i++)
        {
            for (var j = i + 1; j < used.Count; j++)
            {
                pairs.Add(Pair(used[i].Site, used[j].Site, used[j].Arrival.Arrival.SecondsSince(used[i].Arrival.Arrival), k));
            }
        }

        var earliest = arrivals.Min(a => a.Arrival);
        var utc = GpsUtc.ToUtc(earliest, table);
        var gmst = Sidereal.GreenwichMeanSiderealDegrees(utc);
        var sky = new List<SkySolution>();
        bool? ringsMeet = null;
        double? residual = null;
        double? residualAllowed = null;
        string skyNote;
        if (used.Count >= 3)
        {
            var positions = used.Select(u => SiteGeometry.Position(u.Site)).ToArray();
            var times = used.Select(u => u.Arrival.Arrival.SecondsSince(earliest)).ToArray();
            var fit = SkySolver.Solve(positions, times);
            sky.AddRange(fit.Solutions.Select(s =>
            {
                var eq = SkyFrame.ToEquatorial(s.Direction, gmst);
                return new SkySolution(eq.RaDegrees, eq.DecDegrees, s.ResidualSeconds, s.Direction);
            }));
            ringsMeet = fit.RingsMeet;
            residual = fit.MinimalResidualSeconds;
            var rmsSigma = Math.Sqrt(used.Average(u => u.Site.TimingUncertaintySeconds * u.Site.TimingUncertaintySeconds));
            residualAllowed = k * rmsSigma;
            skyNote = SkyNote(used.Count, fit, residualAllowed.Value);
        }
        else
        {
            skyNote = "two sites: the direction is only known to lie on the ring of the pair";
        }

        var consistent = pairs.All(p => p.Consistent) && (residual is null || residual <= residualAllowed);
        var warnings = new List<string>();
        if (!table.Covers(utc.DateTimeUtc))
        {
            warnings.Add($"the earliest arrival is on or after the leap-second table's expiry ({table.ExpiresUtc:yyyy-MM-dd}); UTC and RA may be off by a leap second");
        }

        return new TimingCheckResult(consistent ? "consistent" : "inconsistent", consistent, k, pairs, sky, ringsMeet, residual, residualAllowed, skyNote,
            earliest.ToString(), utc.ToString(6), gmst, Assumptions(k), warnings);
    }

    private static PairTiming Pair(Site a, Site b, double observed, double k)
    {
        var baseline = Baseline.Between(a, b);
        var sigma = Math.Sqrt((a.TimingUncertaintySeconds * a.TimingUncertaintySeconds) + (b.TimingUncertaintySeconds * b.TimingUncertaintySeconds));
        var allowed = baseline.LightTravelSeconds + (k * sigma);
        var margin = allowed - Math.Abs(observed);
        var cosine = PhysicalConstants.SpeedOfLightMetersPerSecond * observed / baseline.BaselineMeters;
        double? ring = Math.Abs(cosine) <= 1 ? double.RadiansToDegrees(Math.Acos(cosine)) : null;
        var rule = string.Create(CultureInfo.InvariantCulture,
            $"allowed = light-travel {baseline.LightTravelSeconds * 1e3:0.000} ms + {k:0.##}σ × {sigma * 1e3:0.000} ms = {allowed * 1e3:0.000} ms; observed {observed * 1e3:0.000} ms");
        return new PairTiming(a.Code, b.Code, baseline.BaselineMeters, baseline.LightTravelSeconds, sigma, allowed, observed, margin,
            margin >= 0, cosine, ring, rule);
    }

    private static string SkyNote(int siteCount, SkyFit fit, double allowed)
    {
        var ms = (double s) => (s * 1e3).ToString("0.000###", CultureInfo.InvariantCulture);
        if (siteCount == 3)
        {
            return fit.RingsMeet
                ? "the three rings meet in two mirror-image directions (reflections through the plane of the sites)"
                : $"the rings do not meet: the closest direction leaves an RMS arrival residual of {ms(fit.MinimalResidualSeconds)} ms (allowed {ms(allowed)} ms)";
        }

        return $"least-squares direction over {siteCount} sites: RMS arrival residual {ms(fit.MinimalResidualSeconds)} ms (allowed {ms(allowed)} ms)"
            + (fit.Solutions.Count > 1 ? "; the sites are nearly coplanar, so a mirror direction fits equally well" : string.Empty);
    }

    private static List<string> Assumptions(double k) =>
    [
        "plane wave from a distant source; a site at r sees it at t = t0 - n·r/c, n toward the source",
        "site positions on the WGS-84 ellipsoid (NIMA TR8350.2); c = 299 792 458 m/s; straight-line baselines",
        $"allowed window = light-travel time + {k.ToString("0.##", CultureInfo.InvariantCulture)} × sqrt(σa² + σb²), one-sigma site timing uncertainties independent",
        "ring angle measured from r_a - r_b: cos θ = c (t_b - t_a) / d; no ring when |c Δt / d| > 1",
        "RA/Dec are mean-of-date (GMST, IAU 1982 / Meeus eq. 12.4), UT1 taken as UTC (< 0.004°), not ICRS (up to ~0.2° off)",
        "UTC from the bundled leap-second table",
    ];

    private static List<(Site Site, SiteArrival Arrival)> Validate(IReadOnlyList<Site> sites, IReadOnlyList<SiteArrival> arrivals, TimingOptions options)
    {
        if (!double.IsFinite(options.KSigma) || options.KSigma < 0)
        {
            throw new ArgumentException($"kSigma must be a finite number ≥ 0 (got {options.KSigma}).", nameof(options));
        }

        if (options.MaxArrivalSpreadSeconds is { } guard && (!double.IsFinite(guard) || guard <= 0))
        {
            throw new ArgumentException("maxArrivalSpreadSeconds must be a finite number > 0.", nameof(options));
        }

        var byCode = new Dictionary<string, Site>(StringComparer.OrdinalIgnoreCase);
        foreach (var site in sites)
        {
            if (!byCode.TryAdd(site.Code, site))
            {
                throw new ArgumentException($"Site code '{site.Code}' appears twice in the network.", nameof(sites));
            }
        }

        if (arrivals.Count < 2)
        {
            throw new ArgumentException("At least two arrivals (at two different sites) are needed.", nameof(arrivals));
        }

        var used = new List<(Site, SiteArrival)>();
        var seen = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        foreach (var arrival in arrivals)
        {
            if (arrival is null || string.IsNullOrWhiteSpace(arrival.SiteCode))
            {
                throw new ArgumentException("Every arrival needs a site code.", nameof(arrivals));
            }

            var code = arrival.SiteCode.Trim();
            if (!byCode.TryGetValue(code, out var site))
            {
                throw new ArgumentException($"Unknown site code '{code}' in arrivals (the network has: {string.Join(", ", byCode.Keys)}).", nameof(arrivals));
            }

            if (!seen.Add(code))
            {
                throw new ArgumentException($"Duplicate arrival for site '{code}'.", nameof(arrivals));
            }

            if (arrival.Snr is { } snr && (!double.IsFinite(snr) || snr < 0))
            {
                throw new ArgumentException($"SNR of site '{code}' must be a finite number ≥ 0.", nameof(arrivals));
            }

            used.Add((site, arrival));
        }

        var spread = arrivals.Max(a => a.Arrival).SecondsSince(arrivals.Min(a => a.Arrival));
        if (options.MaxArrivalSpreadSeconds is { } max && spread > max)
        {
            throw new ArgumentException($"Arrivals span {spread:0.######} s, more than maxArrivalSpreadSeconds = {max} s: check the times.", nameof(arrivals));
        }

        return used;
    }
}
