using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Significance;
using EventReview.Core.Verdicts;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Runs the time-slide background check on trigger and segment files attached to a case and stores the result as a
/// computation record on the item. The check itself (pairs, the triple for three sites, the joint figure and the verdict)
/// is Core's <see cref="BackgroundCheck"/>; this service gathers the files and the case's arrivals and stores the record.
/// Re-running with the same files and parameters adds nothing.
/// </summary>
public sealed class BackgroundCheckService(CaseQueries cases, CaseWorkflow workflow, NetworkService network, CaseFiles files)
{
    /// <summary>Kind of the computation records made here.</summary>
    public const string Kind = Core.Checklists.CheckKind.Background;

    /// <summary>Loudest background coincidences kept per pair (table and exact top of the curve).</summary>
    public const int LoudestKept = 20;

    /// <summary>Curve points kept per pair in the stored record.</summary>
    public const int CurvePointsKept = 150;

    /// <summary>How each pair of the chosen sites would be analysed (window and candidate statistic with their origin).</summary>
    /// <exception cref="ArgumentException">When a site is not among the case's arrivals, or the window cannot be derived.</exception>
    public async Task<IReadOnlyList<BackgroundPairPlan>> PlanAsync(ReviewCase c, IReadOnlyList<string> siteCodes, double? windowMs, double toleranceMs,
        double? candidateStatistic, CancellationToken ct = default)
    {
        var net = await network.GetAsync(ct);
        foreach (var code in siteCodes)
        {
            Arrival(c, code);
        }

        return BackgroundPlanner.Pairs(siteCodes, net.Find, windowMs, toleranceMs, code => Arrival(c, code).Snr, candidateStatistic);
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
        var codes = picks.Select(p => p.SiteCode.ToUpperInvariant()).ToList();
        var plans = await PlanAsync(c, codes, parameters.WindowMs, parameters.ToleranceMs, parameters.CandidateStatistic, ct);
        foreach (var plan in plans)
        {
            BackgroundPlanner.RequireStepMuchLongerThanWindow(parameters.StepSeconds, plan.WindowMs, plan.Name);
        }

        var (tripleStat, tripleRule) = BackgroundPlanner.Statistic(parameters.CandidateStatistic, codes, code => Arrival(c, code).Snr);
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

        var settings = new BackgroundCheckSettings
        {
            StepSeconds = parameters.StepSeconds,
            Slides = parameters.SlidesK,
            ObservingTimeSeconds = parameters.ObservingTimeSeconds,
            RemoveCandidateTriggers = parameters.RemoveCandidateTriggers,
            Arrivals = c.Arrivals.ToDictionary(a => a.SiteCode.ToUpperInvariant(), a => a.Arrival, StringComparer.Ordinal),
            CandidateTime = c.Gps,
            TripleStatistic = tripleStat,
            TripleStatisticRule = tripleRule,
            LoudestCount = LoudestKept,
            CurvePoints = CurvePointsKept,
        };
        var check = await Task.Run(() => BackgroundCheck.Run(sites, plans, settings, progress, ct), ct);
        var svgs = check.Pairs.Select(p => Core.Plots.PlotSvg.Write(Core.Plots.Figures.BackgroundFigure.Build(p.Result))).ToList();
        var record = new BackgroundRecordResult(RecordFormat.Current, siteInputs, check);
        var summary = SignificanceText.Summary(check, parameters.StepSeconds);
        var updated = await workflow.AddComputationAsync(user, caseId, itemKey,
            now => new ComputationRecord(Kind, parametersJson, inputFingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(record), check.Judgement.Word, summary,
                string.Join(CheckRecords.PictureSeparator, svgs), user.ToActor(), now), ct);
        return (updated, true, summary);
    }

    private static CaseArrival Arrival(ReviewCase c, string code) =>
        c.Arrivals.FirstOrDefault(a => string.Equals(a.SiteCode, code, StringComparison.OrdinalIgnoreCase))
        ?? throw new ArgumentException($"Site {code} has no arrival in case {c.CandidateId}; pick files only for the sites of its arrivals ({string.Join(", ", c.Arrivals.Select(a => a.SiteCode))}).", "Sites");
}
