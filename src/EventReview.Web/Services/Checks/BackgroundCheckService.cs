using System.Diagnostics;
using System.Globalization;
using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Geodesy;
using EventReview.Core.Significance;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Runs the time-slide background check on trigger and segment files attached to a case and stores the result as a
/// computation record on the item: every pair of the chosen sites is slid separately (time slides as in Was et al. 2010,
/// Class. Quantum Grav. 27 015005). Re-running with the same files and parameters adds nothing.
/// </summary>
public sealed class BackgroundCheckService(CaseService cases, NetworkService network, CaseFiles files)
{
    /// <summary>Kind of the computation records made here.</summary>
    public const string Kind = Core.Checklists.CheckKind.Background;

    /// <summary>Loudest background coincidences kept per pair (table and exact top of the curve).</summary>
    public const int LoudestKept = 20;

    /// <summary>Curve points kept per pair in the stored record.</summary>
    public const int CurvePointsKept = 150;

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>How each pair of the chosen sites would be analysed (window and candidate statistic with their origin).</summary>
    /// <exception cref="ArgumentException">When a site is not among the case's arrivals, or the window cannot be derived.</exception>
    public async Task<IReadOnlyList<BackgroundPairPlan>> PlanAsync(ReviewCase c, IReadOnlyList<string> siteCodes, double? windowMs, double toleranceMs,
        double? candidateStatistic, CancellationToken ct = default)
    {
        var net = await network.GetAsync(ct);
        var codes = siteCodes.Select(s => s.Trim().ToUpperInvariant()).Distinct().OrderBy(s => s, StringComparer.Ordinal).ToList();
        var plans = new List<BackgroundPairPlan>();
        for (var i = 0; i < codes.Count; i++)
        {
            for (var j = i + 1; j < codes.Count; j++)
            {
                var a = Arrival(c, codes[i]);
                var b = Arrival(c, codes[j]);
                var sa = net.Find(codes[i]);
                var sb = net.Find(codes[j]);
                double? lightMs = sa is not null && sb is not null ? Baseline.Between(sa, sb).LightTravelSeconds * 1e3 : null;
                string windowRule;
                double window;
                if (windowMs is { } w)
                {
                    window = w;
                    windowRule = lightMs is { } l ? string.Create(Inv, $"given (light-travel {l:F1} ms)") : "given";
                }
                else
                {
                    var l = lightMs ?? throw new ArgumentException($"Site {(sa is null ? codes[i] : codes[j])} is not in the network, so the light-travel window cannot be derived; give the window in ms.", "WindowMs");
                    window = Math.Round(l + toleranceMs, 3);
                    windowRule = string.Create(Inv, $"light-travel {l:F1} ms + tolerance {toleranceMs:0.###} ms");
                }

                var stat = candidateStatistic ?? Math.Round(Math.Sqrt((a.Snr * a.Snr) + (b.Snr * b.Snr)), 3);
                var statRule = candidateStatistic is null
                    ? string.Create(Inv, $"√({a.Snr:0.##}² + {b.Snr:0.##}²) from the case's arrivals")
                    : "given";
                plans.Add(new BackgroundPairPlan(codes[i], codes[j], lightMs is { } lm ? Math.Round(lm, 4) : null, window, windowRule, stat, statRule));
            }
        }

        return plans;
    }

    /// <summary>Runs the check; returns the updated case, whether a new record was added, and the record's summary.</summary>
    /// <param name="progress">Called with (fraction 0..1, sentence) as the slides are searched.</param>
    /// <exception cref="ArgumentException">When inputs are unusable (missing pick, bad parameter, step not much longer than the window).</exception>
    /// <exception cref="FormatException">When a file does not parse (the message names the file and line).</exception>
    public async Task<(ReviewCase Case, bool Added, string Summary)> RunAsync(ClaimsPrincipal user, int caseId, string itemKey, BackgroundCheckParameters parameters,
        Action<double, string>? progress = null, CancellationToken ct = default)
    {
        Permissions.Require(user, Auth.Policies.Work, "run checks");
        parameters.Validate();
        var c = await cases.GetAsync(user, caseId, ct);
        var item = c.Item(itemKey);
        if (c.Arrivals.Count < 2)
        {
            throw new ArgumentException($"The background check needs arrivals at two or more sites; case {c.CandidateId} has {c.Arrivals.Count}.", "arrivals");
        }

        var picks = parameters.Sites.OrderBy(s => s.SiteCode.ToUpperInvariant(), StringComparer.Ordinal).ToList();
        var plans = await PlanAsync(c, [.. picks.Select(p => p.SiteCode)], parameters.WindowMs, parameters.ToleranceMs, parameters.CandidateStatistic, ct);
        foreach (var plan in plans)
        {
            BackgroundCheckParameters.RequireStepMuchLongerThanWindow(parameters.StepSeconds, plan.WindowMs, plan.Name);
        }

        var attached = CaseFiles.List(c).ToDictionary(f => f.Sha256, StringComparer.Ordinal);
        string NameOf(string sha, string site, string what) => attached.TryGetValue(sha, out var f)
            ? f.FileName
            : throw new ArgumentException($"The {what} file picked for site {site} is not attached to case {c.CandidateId}.", "Sites");
        var inputs = new
        {
            sites = picks.Select(p => new { code = p.SiteCode.ToUpperInvariant(), p.TriggersSha256, p.SegmentsSha256 }),
            plans,
            arrivals = c.Arrivals.OrderBy(a => a.SiteCode).Select(a => new { a.SiteCode, a.ArrivalNanoseconds, a.Snr }),
        };
        var inputFingerprint = CheckRecords.Fingerprint(inputs);
        var parametersJson = CheckRecords.Serialize(parameters);
        var latest = CheckRecords.Latest(item.Computations, Kind);
        if (CheckRecords.SameRun(latest, inputFingerprint, parametersJson))
        {
            return (c, false, latest.Summary);
        }

        // read every file first: a file that does not parse stops the check before anything is computed or stored
        var sites = new Dictionary<string, SiteTriggers>(StringComparer.Ordinal);
        var siteInputs = new List<BackgroundSiteInput>();
        foreach (var p in picks)
        {
            var code = p.SiteCode.ToUpperInvariant();
            var trigName = NameOf(p.TriggersSha256, code, "trigger");
            var segName = NameOf(p.SegmentsSha256, code, "segment");
            progress?.Invoke(0, $"reading {trigName} and {segName}");
            var triggers = TriggerCsv.Parse(new StringReader(await files.ReadTextAsync(p.TriggersSha256, ct)), trigName);
            var segments = SegmentCsv.Parse(new StringReader(await files.ReadTextAsync(p.SegmentsSha256, ct)), segName);
            var st = SiteTriggers.Create(code, triggers, segments.Segments);
            sites[code] = st;
            siteInputs.Add(new BackgroundSiteInput(code, trigName, p.TriggersSha256, triggers.Count, st.Triggers.Count, st.DroppedOutsideSegments,
                segName, p.SegmentsSha256, segments.RowsRead, segments.MergedCount, st.Segments.Sum(s => s.DurationSeconds)));
        }

        var pairs = new List<BackgroundPairRecord>();
        var svgs = new List<string>();
        var watch = Stopwatch.StartNew();
        for (var i = 0; i < plans.Count; i++)
        {
            var plan = plans[i];
            var options = Options(plan, parameters, Arrival(c, plan.SiteA).Arrival);
            var pairWatch = Stopwatch.StartNew();
            var label = plans.Count > 1 ? $"pair {i + 1} of {plans.Count} ({plan.Name}): " : string.Empty;
            var reporter = progress is null ? null : new Reporter(p => progress(
                (i + p.Fraction) / plans.Count,
                string.Create(Inv, $"{label}slide {p.SlidesDone:N0} of {p.SlidesTotal:N0}, {p.CoincidencesFound:N0} coincidences, {watch.Elapsed.TotalSeconds:F1} s")));
            var result = TimeSlideBackground.Run(sites[plan.SiteA], sites[plan.SiteB], options, reporter, ct);
            var elapsed = pairWatch.Elapsed.TotalSeconds;
            svgs.Add(BackgroundPlotSvg.Render(result, width: 960, height: 460));
            pairs.Add(Judge(plan, result with { Curve = Decimate(result.Curve, CurvePointsKept) }, elapsed));
        }

        var headline = pairs.Select((p, i) => (p, i)).OrderByDescending(x => x.p.Result.FarHz).ThenBy(x => x.i).First().i;
        var verdict = pairs.Any(p => p.Verdict == "concern") ? "concern" : "consistent";
        var record = new BackgroundRecordResult(siteInputs, pairs, headline, verdict, BackgroundWords.SecondsPerYear, Method(parameters));
        var summary = Summarise(record, parameters);
        var updated = await cases.AddComputationAsync(user, caseId, itemKey,
            now => new ComputationRecord(Kind, parametersJson, inputFingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(record), verdict, summary,
                string.Join(CheckRecords.PictureSeparator, svgs), user.ToActor(), now), ct);
        return (updated, true, summary);
    }

    /// <summary>The Core options used for a pair (public so that a reader can recompute the stored numbers exactly).</summary>
    public static TimeSlideOptions Options(BackgroundPairPlan plan, BackgroundCheckParameters parameters, Core.Time.GpsTime candidateTime) =>
        TimeSlideOptions.Create(plan.WindowMs, parameters.StepSeconds, parameters.SlidesK) with
        {
            CandidateStatistic = plan.CandidateStatistic,
            ObservingTimeSeconds = parameters.ObservingTimeSeconds,
            RemoveCandidateTriggers = parameters.RemoveCandidateTriggers,
            CandidateTime = candidateTime,
            LoudestCount = LoudestKept,
        };

    /// <summary>One line: band, FAR (Hz and per year, bound stated), FAP over T_obs, sigma, background time, slides, window and step.</summary>
    public static string Summarise(BackgroundRecordResult record, BackgroundCheckParameters parameters)
    {
        var h = record.Pairs[record.HeadlinePair];
        var r = h.Result;
        var figures = BackgroundWords.Figures(r);
        var text = string.Create(Inv,
            $"{h.Band}{(record.Pairs.Count > 1 ? $" (least significant of {record.Pairs.Count} pairs: {h.Plan.Name})" : $" ({h.Plan.Name})")}: {BackgroundWords.Far(figures, r.BackgroundSeconds)}, {BackgroundWords.FapSigma(figures, r.ObservingTimeSeconds)}; background {r.BackgroundSeconds:0.##e+0} s ({r.BackgroundSeconds / 86400:N0} days) from {r.Slides:N0} slides, window ±{r.WindowSeconds * 1e3:0.#} ms, step {parameters.StepSeconds:0.###} s.");
        if (r.WithoutCandidateTriggers is { } w)
        {
            text += string.Create(Inv, $" Without the candidate's own triggers: {(w.FarIsBound ? "< " : string.Empty)}{w.FarHz:0.##e+0} Hz, {(w.FarIsBound ? "≥ " : string.Empty)}{w.Sigma:F2}σ.");
        }

        var others = record.Pairs.Where((_, i) => i != record.HeadlinePair).ToList();
        if (others.Count > 0)
        {
            text += " Other pairs: " + string.Join("; ", others.Select(o => string.Create(Inv,
                $"{o.Plan.Name} {(o.Result.FarIsBound ? "< " : string.Empty)}{o.Result.FarHz:0.##e+0} Hz, {(o.Result.FarIsBound ? "≥ " : string.Empty)}{o.Result.Sigma:F2}σ"))) + ".";
        }

        var concern = record.Pairs.FirstOrDefault(p => p.Verdict == "concern");
        if (concern is not null)
        {
            text += " Concern: " + concern.VerdictReason;
        }

        return text;
    }

    private static BackgroundPairRecord Judge(BackgroundPairPlan plan, BackgroundResult r, double elapsedSeconds)
    {
        var max = BackgroundWords.MaxReachableSigma(r.BackgroundSeconds, r.ObservingTimeSeconds);
        var need = BackgroundWords.BackgroundMultipleFor(3);
        var ratio = r.BackgroundSeconds / r.ObservingTimeSeconds;
        var concern = max < 3;
        var reason = concern
            ? string.Create(Inv, $"{plan.Name}: the background time ({r.BackgroundSeconds:0.##e+0} s) is only {ratio:0.#} × the observing time ({r.ObservingTimeSeconds:0.##e+0} s), so even with no louder background the FAR bound cannot go below {1 / r.BackgroundSeconds:0.##e+0} Hz and the sigma cannot exceed {max:F2}; 3σ needs at least {need:N0} × T_obs (more slides, a longer span, or a shorter T_obs).")
            : string.Create(Inv, $"{plan.Name}: the background time ({r.BackgroundSeconds:0.##e+0} s, {ratio:N0} × T_obs) can resolve up to {max:F2}σ; the figures are computed, {(r.FarIsBound ? "the FAR as a bound" : "the FAR as a measured rate")}.");
        return new BackgroundPairRecord(plan, r, BackgroundWords.Band(r.Sigma), max, concern ? "concern" : "consistent", reason, Math.Round(elapsedSeconds, 3));
    }

    private static List<string> Method(BackgroundCheckParameters p) =>
    [
        "Time slides as in Was et al. 2010, Class. Quantum Grav. 27 015005: the second site of each pair (by code) is moved by k × step, k = ±1..±K, on a ring over the analysed span; zero lag is never background.",
        "Each pair of sites is analysed on its own; three-site coincidences are not ranked jointly. The summary quotes the least significant pair (largest FAR) to stay conservative; no trials factor for the number of pairs, searches or pipelines is applied.",
        string.Create(Inv, $"Step ≥ {BackgroundCheckParameters.MinStepOverWindow:0} × window is required (slides stay independent; common practice)."),
        "Sigma bands: ≥ 5σ, 3–5σ, < 3σ (one-sided Gaussian); when no background coincidence is as loud, the FAR is an upper bound and the sigma a lower bound.",
        "Verdict: consistent = the figures were computed and the background time can reach 3σ; concern = the background time is too short for the bound to reach 3σ. Whether the candidate is a detection is for people to decide.",
        p.RemoveCandidateTriggers
            ? "Both are reported: the background with every coincidence included, and without any coincidence that uses one of the candidate's own triggers (the zero-lag coincidence nearest the first site's arrival)."
            : "The candidate's own triggers were left in the background.",
        string.Create(Inv, $"Per year = × {BackgroundWords.SecondsPerYear:0} s (Julian year). Curve stored at ≤ {CurvePointsKept} points; the {LoudestKept} loudest background coincidences are kept."),
    ];

    private static CaseArrival Arrival(ReviewCase c, string code) =>
        c.Arrivals.FirstOrDefault(a => string.Equals(a.SiteCode, code, StringComparison.OrdinalIgnoreCase))
        ?? throw new ArgumentException($"Site {code} has no arrival in case {c.CandidateId}; pick files only for the sites of its arrivals ({string.Join(", ", c.Arrivals.Select(a => a.SiteCode))}).", "Sites");

    /// <summary>Keeps at most <paramref name="max"/> points, evenly spread in log(count), always the first and last.</summary>
    private static List<BackgroundCurvePoint> Decimate(IReadOnlyList<BackgroundCurvePoint> curve, int max)
    {
        if (curve.Count <= max)
        {
            return [.. curve];
        }

        // curve is by increasing statistic, so decreasing count
        var step = (Math.Log(curve[0].Count) - Math.Log(curve[^1].Count)) / (max - 2);
        var kept = new List<BackgroundCurvePoint> { curve[0] };
        for (var i = 1; i < curve.Count - 1; i++)
        {
            if (Math.Log(kept[^1].Count) - Math.Log(curve[i].Count) >= step)
            {
                kept.Add(curve[i]);
            }
        }

        kept.Add(curve[^1]);
        return kept;
    }

    /// <summary>Reports synchronously on the searching thread (Progress&lt;T&gt; would post to a context).</summary>
    private sealed class Reporter(Action<BackgroundProgress> report) : IProgress<BackgroundProgress>
    {
        public void Report(BackgroundProgress value) => report(value);
    }
}
