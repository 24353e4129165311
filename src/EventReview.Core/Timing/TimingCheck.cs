using System.Globalization;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Statistics;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Timing;

/// <summary>
/// Cross-site timing check: for every pair of sites with an arrival, the observed difference against its <see cref="PairWindow"/>
/// (light-travel time plus k × sqrt(σa² + σb²)); the sky ring of each pair (cos θ = c Δt / d about r_a - r_b); and, for three or
/// more sites, the source directions that fit all arrivals (see <see cref="SkySolver"/>, weighted by 1/σ²) with the chi-square test
/// of the best one. Deterministic: the same input gives the same result.
/// </summary>
public static class TimingCheck
{
    /// <summary>The frame of every RA/Dec this check gives, as printed next to them.</summary>
    public const string SkyFrameLabel = "mean of date";

    /// <summary>Runs the check. Pairs are formed in the order of <paramref name="arrivals"/> (a before b).</summary>
    /// <exception cref="ArgumentException">Naming the field or site code: fewer than two arrivals, unknown or duplicate site code,
    /// duplicate site codes in <paramref name="sites"/>, non-finite SNR or k, a false-alarm probability outside (0, 1), or arrivals
    /// spread beyond the guard.</exception>
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
        var centuries = Precession.CenturiesSinceJ2000(utc.DateTimeUtc);
        var sky = new List<SkySolution>();
        SkyTest? test = null;
        if (used.Count >= 3)
        {
            var positions = used.Select(u => SiteGeometry.Position(u.Site)).ToArray();
            var times = used.Select(u => u.Arrival.Arrival.SecondsSince(earliest)).ToArray();
            var sigmas = used.Select(u => u.Site.TimingUncertaintySeconds).ToArray();
            var fit = SkySolver.Solve(positions, times, sigmas);
            sky.AddRange(fit.Solutions.Select(s =>
            {
                var eq = SkyFrame.ToEquatorial(s.Direction, gmst);
                return new SkySolution(eq.RaDegrees, eq.DecDegrees, s.ResidualSeconds, s.Direction, s.ChiSquare, Precession.OffsetDegrees(eq, centuries));
            }));
            test = SkyTest.Of(used.Count, fit, options.FalseAlarmProbability);
        }

        var judgement = Judge(pairs, test, options.FalseAlarmProbability);
        var warnings = LeapSecondWarnings.For(table, utc.DateTimeUtc, null);

        var skyNote = test?.Note ?? "two sites: the direction is only known to lie on the ring of the pair; no sky residual test";
        var maxOffset = sky.Count > 0 ? sky.Max(s => s.IcrsOffsetDegrees) : Precession.OffsetDegrees(new EquatorialDirection(0, 0), centuries);
        var consistent = judgement.Verdict == Verdict.Consistent;
        return new TimingCheckResult(judgement.Word, consistent, k, pairs, sky, test?.Fit.RingsMeet, test?.Fit.MinimalResidualSeconds, skyNote,
            earliest.ToString(), utc.ToString(6), gmst, Assumptions(k, options.FalseAlarmProbability, maxOffset), warnings,
            test?.Fit.MinimalChiSquare, test?.DegreesOfFreedom, test?.PValue, test?.IsBound ?? false, options.FalseAlarmProbability, SkyFrameLabel, judgement);
    }

    private static PairTiming Pair(Site a, Site b, double observed, double k)
    {
        var window = PairWindow.For(a, b, k);
        var margin = window.AllowedSeconds - Math.Abs(observed);
        var cosine = PhysicalConstants.SpeedOfLightMetersPerSecond * observed / window.BaselineMeters;
        double? ring = Math.Abs(cosine) <= 1 ? double.RadiansToDegrees(Math.Acos(cosine)) : null;
        var rule = string.Create(CultureInfo.InvariantCulture,
            $"allowed = light-travel {window.LightTravelSeconds * 1e3:0.000} ms + {k:0.##}σ × {window.CombinedSigmaSeconds * 1e3:0.000} ms = {window.AllowedSeconds * 1e3:0.000} ms; observed {observed * 1e3:0.000} ms");
        return new PairTiming(a.Code, b.Code, window.BaselineMeters, window.LightTravelSeconds, window.CombinedSigmaSeconds, window.AllowedSeconds, observed, margin,
            margin >= 0, cosine, ring, rule);
    }

    private static Judgement Judge(List<PairTiming> pairs, SkyTest? test, double fap)
    {
        var ci = CultureInfo.InvariantCulture;
        var failed = pairs.Where(p => !p.Consistent).ToList();
        var problems = failed.Select(p => string.Create(ci,
            $"{p.A}–{p.B}: |Δt| = {Math.Abs(p.ObservedSeconds) * 1e3:0.000} ms > allowed {p.AllowedSeconds * 1e3:0.000} ms")).ToList();
        if (test is { Passes: false })
        {
            problems.Add(test.Note);
        }

        if (problems.Count > 0)
        {
            return new Judgement(Verdict.Inconsistent, string.Join("; ", problems));
        }

        var tightest = pairs.OrderBy(p => p.MarginSeconds).First();
        var text = string.Create(ci,
            $"{pairs.Count} of {pairs.Count} pairs within their windows (tightest {tightest.A}–{tightest.B}: |Δt| {Math.Abs(tightest.ObservedSeconds) * 1e3:0.000} ms ≤ {tightest.AllowedSeconds * 1e3:0.000} ms)");
        text += test is null ? "; two sites: no sky residual test" : "; " + test.Note;
        return new Judgement(Verdict.Consistent, text);
    }

    private static List<string> Assumptions(double k, double fap, double offsetDegrees)
    {
        var ci = CultureInfo.InvariantCulture;
        return
        [
            "plane wave from a distant source; a site at r sees it at t = t0 - n·r/c, n toward the source",
            "site positions on the WGS-84 ellipsoid (NIMA TR8350.2); c = 299 792 458 m/s; straight-line baselines",
            string.Create(ci, $"allowed window = light-travel time + {k:0.##} × sqrt(σa² + σb²), one-sigma site timing uncertainties independent"),
            "ring angle measured from r_a - r_b: cos θ = c (t_b - t_a) / d; no ring when |c Δt / d| > 1",
            string.Create(ci, $"sky fit: the direction minimising χ² = Σ ((t_i - t0 + n·r_i/c) / σ_i)² with t0 fitted; errors Gaussian and independent; χ² has arrivals - 3 degrees of freedom (two angles and t0); inconsistent when P(χ² ≥ observed) < {fap:G3} (the two-sided tail of the 3σ pair rule)"),
            "three sites: 0 degrees of freedom, so no residual test is possible while the rings meet; when they do not, the closest direction's χ² is judged with 1 degree of freedom, a conservative bound for a miss at the edge of the allowed region (Self and Liang 1987, from memory)",
            string.Create(ci, $"RA/Dec are mean of date (GMST rotation, IAU 1982 / Meeus eq. 12.4; UT1 taken as UTC, < 0.004°; no nutation, < 0.006°), not ICRS: at this date they differ from J2000 / ICRS coordinates by up to {offsetDegrees:0.00}° (IAU 1976 precession)"),
            "UTC from the bundled leap-second table",
        ];
    }

    private static List<(Site Site, SiteArrival Arrival)> Validate(IReadOnlyList<Site> sites, IReadOnlyList<SiteArrival> arrivals, TimingOptions options)
    {
        if (!double.IsFinite(options.KSigma) || options.KSigma < 0)
        {
            throw new ArgumentException($"kSigma must be a finite number ≥ 0 (got {options.KSigma}).", nameof(options));
        }

        if (!(options.FalseAlarmProbability > 0 && options.FalseAlarmProbability < 1))
        {
            throw new ArgumentException($"falseAlarmProbability must lie strictly between 0 and 1 (got {options.FalseAlarmProbability}).", nameof(options));
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
