using System.Text;
using EventReview.Core.Evidence;
using EventReview.Core.Evidence.Roles;
using EventReview.Core.Time;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Demo;

/// <summary>
/// Demo data for the time-slide background of ER-C-0142: simulated trigger and segment files for its three sites over
/// three days around the candidate, attached to <c>significance.time-slides</c>, and the check run once on them with
/// K = 5,000 (10,000 slides): enough background for the joint bound over the three pairs and the triple to pass 3 sigma.
/// </summary>
public sealed class BackgroundDemoStep(CaseQueries cases, EvidenceAppender appender, BackgroundCheckService background, ILogger<BackgroundDemoStep> logger) : IDemoSeedStep
{
    public const string CandidateId = "ER-C-0142";

    public const string ItemKey = "significance.time-slides";

    /// <summary>K of the demo run (the app's default): slides k = ±1..±K.</summary>
    public const int SlidesK = 5000;

    public int Order => 60;

    public async Task SeedAsync(DemoContext demo, CancellationToken ct)
    {
        if (!demo.CaseIds.TryGetValue(CandidateId, out var caseId))
        {
            return;
        }

        var watch = System.Diagnostics.Stopwatch.StartNew();
        var user = demo.ReviewerA;
        var c = await cases.GetAsync(user, caseId, ct);
        var day = 86_400L * GpsTime.NanosecondsPerSecond;

        // two days before the candidate to one day after, on whole seconds
        var start = new GpsTime(((c.GpsNanoseconds - (2 * day)) / GpsTime.NanosecondsPerSecond) * GpsTime.NanosecondsPerSecond);
        var end = new GpsTime(start.Nanoseconds + (3 * day));
        var picks = new List<BackgroundSiteFiles>();
        var seed = 4201;
        foreach (var a in c.Arrivals.OrderBy(a => a.SiteCode))
        {
            var files = BackgroundDemoData.Simulate(a.SiteCode, seed++, start, end, a.Arrival, a.Snr);
            var trigSha = await Attach(user, caseId, $"{a.SiteCode}-triggers.csv", new FileRole(FileRoleKind.SearchTriggers, a.SiteCode), files.TriggersCsv,
                $"Simulated {a.SiteCode} trigger list (demo): {files.Triggers:N0} triggers over 3 days, Poisson {BackgroundDemoData.RateHz} Hz, fixed seed.", ct);
            var segSha = await Attach(user, caseId, $"{a.SiteCode}-segments.csv", new FileRole(FileRoleKind.AnalysedTime, a.SiteCode), files.SegmentsCsv,
                $"Simulated {a.SiteCode} analysed time (demo): {files.Segments} segments with gaps.", ct);
            picks.Add(new BackgroundSiteFiles(a.SiteCode, trigSha, segSha));
        }

        var (_, _, summary) = await background.RunAsync(user, caseId, ItemKey, new BackgroundCheckParameters(picks, SlidesK: SlidesK), ct: ct);
        logger.LogInformation("Background demo on {Candidate} in {Seconds:F1} s: {Summary}", CandidateId, watch.Elapsed.TotalSeconds, summary);
    }

    /// <summary>Attaches the text as a file; returns its SHA-256 (the attachment store's key).</summary>
    private async Task<string> Attach(System.Security.Claims.ClaimsPrincipal user, int caseId, string name, FileRole role, string text, string description, CancellationToken ct)
    {
        var bytes = Encoding.UTF8.GetBytes(text);
        using var stream = new MemoryStream(bytes);
        await appender.AddAttachmentAsync(user, caseId, ItemKey, stream, name, "text/csv", description, long.MaxValue, role, ct);
        return Hashing.Sha256Hex(bytes);
    }
}
