using System.Globalization;
using EventReview.Core.Statistics;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;
using EventReview.Core.Formatting;

namespace EventReview.Core.Environment;

/// <summary>
/// Looks up, around each site's arrival time, every auxiliary or environmental trigger and every data-quality segment,
/// with each channel's chance-coincidence probability, veto safety and coupling estimate, and gives a per-site and
/// overall verdict ("concern" when a human should look, otherwise "clear").
/// </summary>
public static class EnvironmentLookup
{
    /// <summary>
    /// Runs the lookup. A hit is a trigger with |t - arrival| &lt;= w(kind). Channel rate R = the channel's triggers inside
    /// the rate window centred on the arrival / rate window length (the hit itself included). Chance probability =
    /// 1 - exp(-2 w R) (Poisson). A site is of concern when a hit's channel is not shown unsafe (safe true or unknown) or a
    /// data-quality segment intersects [arrival - default w, arrival + default w].
    /// </summary>
    public static EnvironmentReport Run(EnvironmentLookupInput input, EnvironmentLookupOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(input);
        options ??= new EnvironmentLookupOptions();
        Validate(options);
        var kinds = input.Sensors.GroupBy(s => ChannelName.Qualified(s.Site, s.Channel)).ToDictionary(g => g.Key, g => g.First());
        var sites = input.Sites.Concat(input.Arrivals.Keys).Select(s => s.ToUpperInvariant()).Distinct().Order(StringComparer.Ordinal).ToList();
        var hits = new List<EnvironmentHit>();
        var segments = new List<ActiveSegment>();
        var verdicts = new List<SiteVerdict>();
        var warnings = new List<string>();
        var channelsMissing = new SortedSet<string>(StringComparer.Ordinal);

        foreach (var site in sites)
        {
            var fromArrival = TryArrival(input.Arrivals, site, out var at);
            at = fromArrival ? at : input.CaseTime;
            var reasons = new List<string>();
            if (!fromArrival)
            {
                warnings.Add($"site {site} has no arrival time: looked up at the case time {input.CaseTime}");
            }

            var siteTriggers = input.Triggers.Where(t => t.Site == site).ToList();
            foreach (var trig in siteTriggers)
            {
                var key = ChannelName.Qualified(site, trig.Channel);
                var kind = kinds.TryGetValue(key, out var sensor) ? sensor.Kind : SensorKind.Other;
                if (sensor is null)
                {
                    channelsMissing.Add(key);
                }

                var w = options.WindowFor(kind);
                var offset = trig.Time.SecondsSince(at);
                if (Math.Abs(offset) > w)
                {
                    continue;
                }

                var half = options.RateWindowSeconds / 2;
                var count = siteTriggers.Count(t => t.Channel == trig.Channel && Math.Abs(t.Time.SecondsSince(at)) <= half);
                var rate = count / options.RateWindowSeconds;
                var safe = input.Safety?.SafetyOf(site, trig.Channel);
                CouplingResult? coupling = null;
                if (options.Coupling is not null && input.CouplingFunctions?.TryGetValue(key, out var cf) == true)
                {
                    coupling = CouplingEstimate.Estimate(cf, options.Coupling, key, trig.Snr, trig.FrequencyHz);
                }

                var concern = safe != false;
                hits.Add(new EnvironmentHit(site, trig.Channel, kind.ToString().ToLowerInvariant(), trig.Time.Seconds, offset, trig.Snr,
                    trig.FrequencyHz, w, rate, Poisson.ChanceCoincidence(w, rate), safe, coupling?.Ratio, coupling?.StrainEstimate,
                    coupling?.Flagged ?? false, concern, coupling is null ? null : $"candidate strain: {coupling.CandidateStrainSource}; sensor amplitude: {coupling.SensorAmplitudeSource}",
                    Math.Sqrt(count) / options.RateWindowSeconds));
                if (concern)
                {
                    reasons.Add(string.Create(CultureInfo.InvariantCulture,
                        $"trigger of {key} ({kind.ToString().ToLowerInvariant()}, SNR {ScientificFormat.Format(trig.Snr, 4)}) at {offset:+0.000;-0.000} s, safety {(safe is null ? "unknown" : "safe")}"));
                }

                if (coupling?.Flagged == true)
                {
                    reasons.Add(string.Create(CultureInfo.InvariantCulture,
                        $"coupling of {key} could reach {coupling.Ratio:P0} of the candidate's strain"));
                }

                if (input.ObservingSegments is { } obs && !obs.Any(s => s.Site == site && s.Start <= trig.Time && s.End > trig.Time))
                {
                    warnings.Add($"trigger of {key} at {trig.Time} lies outside every observing segment of the site");
                }
            }

            var from = at.AddSeconds(-options.DefaultWindowSeconds);
            var to = at.AddSeconds(options.DefaultWindowSeconds);
            foreach (var seg in input.Segments.Where(s => s.Site == site && s.Intersects(from, to)))
            {
                segments.Add(new ActiveSegment(site, seg.Flag, seg.Start.Seconds, seg.End.Seconds, seg.Comment));
                reasons.Add($"data-quality flag '{seg.Flag}' active [{seg.Start}, {seg.End})");
            }

            verdicts.Add(new SiteVerdict(site, at.Seconds, fromArrival, SiteJudgement(site, reasons), reasons));
        }

        hits.Sort((a, b) => a.Site != b.Site ? string.CompareOrdinal(a.Site, b.Site) : a.OffsetSeconds.CompareTo(b.OffsetSeconds));
        var coincidences = FindCoincidences(hits, options.LightTravelWindowSeconds);
        var assumptions = Assumptions(options, channelsMissing);
        return new EnvironmentReport(input.CaseTime.Seconds, hits, segments, coincidences, verdicts, Overall(verdicts, coincidences), warnings, assumptions);
    }

    private static Judgement SiteJudgement(string site, List<string> reasons) => reasons.Count > 0
        ? new Judgement(Verdict.Concern, $"{site}: " + string.Join("; ", reasons))
        : new Judgement(Verdict.Clear, $"{site}: no trigger of a channel not shown unsafe, no coupling flag and no data-quality segment in the window");

    private static Judgement Overall(List<SiteVerdict> sites, List<CrossSiteCoincidence> coincidences)
    {
        var concern = sites.Where(s => s.Judgement.Verdict == Verdict.Concern).ToList();
        var clear = sites.Where(s => s.Judgement.Verdict != Verdict.Concern).Select(s => s.Site).ToList();
        var cross = coincidences.Count > 0 ? $"; {coincidences.Count} cross-site coincidence(s) of the same kind" : string.Empty;
        if (concern.Count == 0)
        {
            return new Judgement(Verdict.Clear, $"nothing needs a look at {(clear.Count > 0 ? string.Join(", ", clear) : "any site")}{cross}");
        }

        return new Judgement(Verdict.Concern, string.Join(" | ", concern.Select(s => s.Judgement.Reason)) + (clear.Count > 0 ? $"; clear at {string.Join(", ", clear)}" : string.Empty) + cross);
    }

    private static List<CrossSiteCoincidence> FindCoincidences(List<EnvironmentHit> hits, double window)
    {
        var list = new List<CrossSiteCoincidence>();
        for (var i = 0; i < hits.Count; i++)
        {
            for (var j = i + 1; j < hits.Count; j++)
            {
                var a = hits[i];
                var b = hits[j];
                if (a.Site != b.Site && a.Kind == b.Kind && Math.Abs(b.TriggerGps - a.TriggerGps) <= window)
                {
                    list.Add(new CrossSiteCoincidence(a.Kind, a.Site, a.Channel, b.Site, b.Channel, b.TriggerGps - a.TriggerGps));
                }
            }
        }

        return list;
    }

    private static List<string> Assumptions(EnvironmentLookupOptions o, SortedSet<string> missing)
    {
        var list = new List<string>
        {
            string.Create(CultureInfo.InvariantCulture, $"window +-{o.DefaultWindowSeconds} s around each site's arrival time (sites without one use the case time)"),
            string.Create(CultureInfo.InvariantCulture, $"channel rate counted over {o.RateWindowSeconds} s centred on the arrival, the hit included"),
            "chance probability 1 - exp(-2 w R): Poisson stream of rate R in a +-w window",
            string.Create(CultureInfo.InvariantCulture, $"cross-site coincidence: same kind within {o.LightTravelWindowSeconds} s (light-travel window)"),
            "concern: any hit of a channel not shown unsafe (safe or unknown), or any data-quality segment active in the window",
        };
        if (o.WindowSecondsByKind is { Count: > 0 } byKind)
        {
            list.Add("windows per kind: " + string.Join(", ", byKind.Select(kv => string.Create(CultureInfo.InvariantCulture, $"{kv.Key.ToString().ToLowerInvariant()} +-{kv.Value} s"))));
        }

        if (o.Coupling is { } c)
        {
            list.Add(string.Create(CultureInfo.InvariantCulture,
                $"coupling: strain = coupling(f) x sensor amplitude (measured spectrum, else SNR x sensor noise amplitude, the noise read from sensor data where given, else typed) in {c.BandLowHz}-{c.BandHighHz} Hz vs the candidate's strain amplitude ({CandidateText(c)}); flagged at >= {c.FlagFraction:P0} (common-practice margin)"));
        }

        if (missing.Count > 0)
        {
            list.Add("channels missing from the inventory treated as kind 'other': " + string.Join(", ", missing));
        }

        return list;
    }

    private static string CandidateText(CouplingOptions c)
    {
        var measured = c.MeasuredStrainAmplitudes is { Count: > 0 } m
            ? "read from strain data at " + string.Join(", ", m.Select(kv => string.Create(CultureInfo.InvariantCulture, $"{kv.Key} {ScientificFormat.Format(kv.Value, 4)}")))
            : null;
        var typed = c.CandidateStrainAmplitude is { } h ? string.Create(CultureInfo.InvariantCulture, $"typed {ScientificFormat.Format(h, 4)}") : "none typed";
        return measured is null ? typed : $"{measured}; elsewhere {typed}";
    }

    private static void Validate(EnvironmentLookupOptions o)
    {
        if (!double.IsFinite(o.DefaultWindowSeconds) || o.DefaultWindowSeconds <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(o), o.DefaultWindowSeconds, "DefaultWindowSeconds must be finite and > 0.");
        }

        if (o.WindowSecondsByKind?.Values.Any(w => !double.IsFinite(w) || w <= 0) == true)
        {
            throw new ArgumentOutOfRangeException(nameof(o), "WindowSecondsByKind values must be finite and > 0.");
        }

        if (!double.IsFinite(o.RateWindowSeconds) || o.RateWindowSeconds <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(o), o.RateWindowSeconds, "RateWindowSeconds must be finite and > 0.");
        }

        if (!double.IsFinite(o.LightTravelWindowSeconds) || o.LightTravelWindowSeconds < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(o), o.LightTravelWindowSeconds, "LightTravelWindowSeconds must be finite and >= 0.");
        }
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
