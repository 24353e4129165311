using System.Globalization;
using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Injections;
using EventReview.Core.Verdicts;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Looks up an attached injection log for injections overlapping the candidate at every site (arrival time, or the case
/// time for a site without one) and stores the result as a computation record. Re-running with the same inputs adds nothing.
/// </summary>
public sealed class InjectionCheckService(CaseQueries cases, CaseWorkflow workflow, NetworkService network, CaseFiles files)
{
    /// <summary>Runs the lookup; returns the updated case and whether a new record was added.</summary>
    /// <exception cref="ArgumentException">A missing pick or a margin out of range.</exception>
    /// <exception cref="FormatException">The log does not parse (message names the file and the line).</exception>
    public async Task<(ReviewCase Case, bool Added)> RunLogAsync(ClaimsPrincipal user, int caseId, string itemKey, InjectionCheckParameters parameters, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "run checks");
        ArgumentNullException.ThrowIfNull(parameters);
        parameters.Validate();
        var c = await cases.GetAsync(user, caseId, ct);
        var item = c.Item(itemKey);
        var known = (await network.GetAsync(ct)).Sites.Select(s => s.Code).ToList();
        var (log, file) = await CheckInputs.ReadTextAsync(files, CaseFiles.List(c), parameters.LogSha, "injection log", r => InjectionLogCsv.Parse(r, known), ct);
        var fingerprint = CheckRecords.Fingerprint(new
        {
            caseGps = c.GpsNanoseconds,
            arrivals = c.Arrivals.OrderBy(a => a.SiteCode).Select(a => new { a.SiteCode, a.ArrivalNanoseconds }),
            log = file.Sha256,
        });
        var parametersJson = CheckRecords.Serialize(parameters);
        var latest = CheckRecords.Latest(item.Computations, CheckKind.Injections);
        if (CheckRecords.SameRun(latest, fingerprint, parametersJson))
        {
            return (c, false);
        }

        var report = InjectionOverlap.Find(log, c.Gps, Arrivals(c), c.Arrivals.Select(a => a.SiteCode), parameters.MarginSeconds);
        var result = new InjectionRecordResult(RecordFormat.Current, "log", report, log.Count, [file], null);
        var summary = Summarise(report, log.Count, $"log '{file.FileName}'");
        var updated = await workflow.AddComputationAsync(user, caseId, itemKey,
            now => new ComputationRecord(CheckKind.Injections, parametersJson, fingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(result),
                report.Judgement.Word, summary, Core.Plots.PlotSvg.Write(Core.Plots.Figures.InjectionTimelineFigure.Build(log, report, c.Gps.Seconds)), user.ToActor(), now), ct);
        return (updated, true);
    }

    /// <summary>Per-site arrival times of a case keyed by site code.</summary>
    public static IReadOnlyDictionary<string, Core.Time.GpsTime> Arrivals(ReviewCase c) =>
        c.Arrivals.ToDictionary(a => a.SiteCode.ToUpperInvariant(), a => a.Arrival, StringComparer.OrdinalIgnoreCase);

    /// <summary>One line: how many rows were read, what overlaps (by status), the margin.</summary>
    public static string Summarise(InjectionOverlapReport report, int rows, string source)
    {
        var sites = string.Join(", ", report.SitesChecked.Select(s => s.Site));
        if (report.Hits.Count == 0)
        {
            return string.Create(CultureInfo.InvariantCulture,
                $"{rows} injection(s) in the {source}; none overlaps the candidate at {sites} (margin ±{report.MarginSeconds:0.###} s).");
        }

        var hits = string.Join("; ", report.Hits.Select(h => string.Create(CultureInfo.InvariantCulture, $"{h.Site} {h.Status} {h.Kind} '{h.WaveformRef}' ({h.OffsetSeconds:+0.###;-0.###;0} s)")));
        return string.Create(CultureInfo.InvariantCulture,
            $"{rows} injection(s) in the {source}; {report.Hits.Count} overlap(s) (margin ±{report.MarginSeconds:0.###} s): {hits}.");
    }
}
