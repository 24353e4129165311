using System.Globalization;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Injections;

/// <summary>Looks up injections overlapping a candidate at every site.</summary>
public static class InjectionOverlap
{
    /// <summary>
    /// Finds every injection (any status) at each site whose span [start - margin, end + margin] contains the site's time
    /// of the candidate: its arrival time when given, otherwise the case time.
    /// </summary>
    /// <param name="injections">Injection log or opened blind record.</param>
    /// <param name="caseTime">Case (candidate) GPS time.</param>
    /// <param name="arrivals">Per-site arrival times (upper-case codes); may be empty.</param>
    /// <param name="sites">Sites to check; every site named in <paramref name="arrivals"/> or in the log is checked too.</param>
    /// <param name="marginSeconds">Margin on both sides of each span, seconds (&gt;= 0).</param>
    public static InjectionOverlapReport Find(IReadOnlyList<InjectionRecord> injections, GpsTime caseTime,
        IReadOnlyDictionary<string, GpsTime> arrivals, IEnumerable<string> sites, double marginSeconds)
    {
        ArgumentNullException.ThrowIfNull(injections);
        ArgumentNullException.ThrowIfNull(arrivals);
        ArgumentNullException.ThrowIfNull(sites);
        if (!double.IsFinite(marginSeconds) || marginSeconds < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(marginSeconds), marginSeconds, "Margin must be finite and >= 0 s.");
        }

        var allSites = sites.Select(s => s.ToUpperInvariant()).Concat(arrivals.Keys.Select(k => k.ToUpperInvariant()))
            .Concat(injections.Select(i => i.Site)).Distinct().Order(StringComparer.Ordinal).ToList();
        var checkedSites = new List<SiteTime>();
        var hits = new List<InjectionOverlapHit>();
        foreach (var site in allSites)
        {
            var fromArrival = TryArrival(arrivals, site, out var t);
            var at = fromArrival ? t : caseTime;
            checkedSites.Add(new SiteTime(site, at.Seconds, fromArrival));
            foreach (var inj in injections.Where(i => i.Site == site))
            {
                var before = inj.Start.SecondsSince(at);
                var after = at.SecondsSince(inj.End);
                if (before <= marginSeconds && after <= marginSeconds)
                {
                    var offset = before > 0 ? -before : after > 0 ? after : 0.0;
                    hits.Add(new InjectionOverlapHit(site, inj.Start.Seconds, inj.End.Seconds, inj.Kind, inj.WaveformRef,
                        inj.Status.ToString().ToLowerInvariant(), offset, inj.Status != InjectionStatus.Aborted));
                }
            }
        }

        var concerning = hits.Where(h => h.Concern).ToList();
        var sitesText = string.Join(", ", checkedSites.Select(s => s.Site));
        var judgement = concerning.Count > 0
            ? new Judgement(Verdict.Concern, string.Create(CultureInfo.InvariantCulture,
                $"{concerning.Count} injection(s) overlap the candidate (margin ±{marginSeconds:0.###} s): {string.Join("; ", concerning.Select(h => $"{h.Site} {h.Status} {h.Kind} '{h.WaveformRef}' ({h.OffsetSeconds:+0.###;-0.###;0} s)"))}"))
            : new Judgement(Verdict.Clear, string.Create(CultureInfo.InvariantCulture,
                $"no performed or scheduled injection overlaps the candidate at {sitesText} (margin ±{marginSeconds:0.###} s){(hits.Count > 0 ? $"; {hits.Count} aborted one(s) listed" : string.Empty)}"));
        var assumptions = new List<string>
        {
            $"an injection overlaps when its span widened by {marginSeconds} s on both sides contains the site's arrival time",
            "sites without an arrival time are looked up at the case time",
            "aborted injections are listed but do not raise a concern",
        };
        return new InjectionOverlapReport(hits, checkedSites, marginSeconds, judgement, assumptions);
    }

    private static bool TryArrival(IReadOnlyDictionary<string, GpsTime> arrivals, string site, out GpsTime t)
    {
        foreach (var (k, v) in arrivals)
        {
            if (string.Equals(k, site, StringComparison.OrdinalIgnoreCase))
            {
                t = v;
                return true;
            }
        }

        t = default;
        return false;
    }
}
