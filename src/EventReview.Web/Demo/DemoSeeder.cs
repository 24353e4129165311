using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Data;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Services;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Demo;

/// <summary>
/// Fills an empty database with the invented demo: the network, four accounts and three candidate cases at
/// different stages. Arrival times are made from an invented sky direction with the network's own geometry.
/// </summary>
public sealed class DemoSeeder(IDbContextFactory<AppDbContext> dbFactory, AccountAdmin accounts, UserManager<AppUser> users, EvidenceAppender appender, CaseWorkflow workflow, TemplateCatalog templates, TimeProvider clock, IEnumerable<IDemoSeedStep> steps)
{
    public async Task SeedIfEmptyAsync(CancellationToken ct = default)
    {
        await using (var db = await dbFactory.CreateDbContextAsync(ct))
        {
            if (await db.Cases.AnyAsync(ct) || await db.Users.AnyAsync(ct) || await db.Networks.AnyAsync(ct))
            {
                return;
            }

            var network = new DetectorNetwork(DemoNetwork.Name);
            foreach (var s in DemoNetwork.Sites())
            {
                network.Add(s);
            }

            db.Networks.Add(network);
            await db.SaveChangesAsync(ct);
        }

        var principals = new Dictionary<string, ClaimsPrincipal>();
        foreach (var a in DemoAccounts.All)
        {
            var (user, _, _) = await accounts.CreateUserAsync(a.Email, a.Role, a.Password, a.DisplayName);
            principals[a.Role + ":" + a.DisplayName] = Principal(user, a.Role);
        }

        var coordinator = principals.First(p => p.Key.StartsWith(Roles.Coordinator, StringComparison.Ordinal)).Value;
        var reviewerA = principals["reviewer:Demo Reviewer A"];
        var reviewerB = principals["reviewer:Demo Reviewer B"];
        var sites = DemoNetwork.Sites();
        var now = clock.GetUtcNow();
        var gpsNow = GpsUtc.FromUtc(now.UtcDateTime);

        // Case 1: a loud three-site candidate, well into its review.
        // A fixed instant: the simulated strain, sky direction and sidereal time of this candidate (and so its overlap
        // result) are then the same on every start; the other candidates follow the clock.
        var t1 = new GpsTime(1_479_697_331_201_000_000);
        var d1 = new DemoCandidate("ER-C-0142", t1, 41.0, -23.0, 0.7, ["KP", "AB", "SM"], [17.1, 19.5, 10.6]);
        var (c1, _) = await workflow.OpenAsync(coordinator, Request(d1, sites,
            "Loud short chirp-like transient seen at all three sites; raised by the demo matched-filter search.", "candidate-review"), ct);
        var rA = users.Users.First(u => u.DisplayName == "Demo Reviewer A");
        await workflow.AssignAsync(coordinator, c1.Id, "timing.arrival", rA.Id, rA.DisplayName, c1.Item("timing.arrival").Version, ct);
        var first = templates.Find("candidate-review")!.Items().First().Item.Key;
        await appender.AddNoteAsync(reviewerA, c1.Id, first,
            "Checked the injection schedule of every site for ±10 s around the candidate: **no injection** scheduled or logged. Screenshots of the three schedules to follow.", ct);
        var c = await workflow.TransitionAsync(reviewerA, c1.Id, first, "ready", null, ct);
        await workflow.SignAsync(reviewerB, c1.Id, first, SignOffMeaning.Reviewed,
            "Read the three schedules myself; nothing within ±10 s.", c.Item(first).Fingerprint(), DemoAccounts.Proof(reviewerB), ct);
        await appender.AddNoteAsync(reviewerA, c1.Id, "timing.arrival",
            "Arrival times taken from the search's trigger record; the built-in timing check is to be run on this item.", ct);

        // Case 2: a fresh two-site candidate from a pipeline, first-hour triage.
        var t2 = new GpsTime(gpsNow.Nanoseconds - (2L * 3600 * GpsTime.NanosecondsPerSecond) + 88_125_000);
        var d2 = new DemoCandidate("ER-C-0157", t2, -12.0, 140.0, 1.9, ["KP", "AB"], [8.4, 7.6]);
        var (c2, _) = await workflow.OpenAsync(coordinator, Request(d2, sites,
            "Two-site coincidence just above threshold; third site was not observing.", "rapid-triage"), ct);

        // Case 3: a rapid triage that ended as instrumental (a glitch at one site).
        var t3 = new GpsTime(gpsNow.Nanoseconds - (20L * 86400 * GpsTime.NanosecondsPerSecond) + 503_000_000);
        var d3 = new DemoCandidate("ER-C-0121", t3, 63.0, 80.0, 0.2, ["KP", "AB", "SM"], [11.0, 6.2, 5.9]);
        var (c3, _) = await workflow.OpenAsync(coordinator, Request(d3, sites,
            "Loud at one site, marginal elsewhere; suspected short symmetric glitch.", "rapid-triage"), ct);
        var current = c3;
        foreach (var item in c3.Items)
        {
            await appender.AddNoteAsync(reviewerA, c3.Id, item.Key, $"Triage note for *{item.Title}*: done; see the attached reasoning in the timeline.", ct);
            current = await workflow.TransitionAsync(reviewerA, c3.Id, item.Key, "ready", null, ct);
            for (var k = 0; k < current.Item(item.Key).RequiredSignOffs; k++)
            {
                var signer = k == 0 ? reviewerB : coordinator;
                current = await workflow.SignAsync(signer, c3.Id, item.Key, SignOffMeaning.Approved, "Agreed on the evidence shown.", current.Item(item.Key).Fingerprint(), DemoAccounts.Proof(signer), ct);
            }
        }

        await workflow.CloseAsync(coordinator, c3.Id, CaseOutcome.Instrumental,
            "A short symmetric glitch at one site explains the trigger; no consistent signal at the other sites.", ct);

        var demo = new DemoContext(coordinator, reviewerA, reviewerB,
            new Dictionary<string, int> { [d1.CandidateId] = c1.Id, [d2.CandidateId] = c2.Id, [d3.CandidateId] = c3.Id }, sites,
            new Dictionary<string, DemoCandidate> { [d1.CandidateId] = d1, [d2.CandidateId] = d2, [d3.CandidateId] = d3 });
        foreach (var step in steps.OrderBy(s => s.Order))
        {
            await step.SeedAsync(demo, ct);
        }
    }

    /// <summary>Per-site delays and antenna factors of a demo candidate (its invented sky direction and polarisation).</summary>
    public static IReadOnlyList<SiteProjection> Project(DemoCandidate d, IReadOnlyList<Site> sites)
    {
        var gmst = Sidereal.GreenwichMeanSiderealDegrees(GpsUtc.ToUtc(d.Time).DateTimeUtc);
        var n = SkyFrame.ToEcef(d.RaDegrees, d.DecDegrees, gmst);
        return NetworkProjection.Project(sites.Where(s => d.SiteCodes.Contains(s.Code)).ToList(), n, d.PsiRadians);
    }

    private static OpenCaseRequest Request(DemoCandidate d, IReadOnlyList<Site> sites, string summary, string checklist)
    {
        var projection = Project(d, sites);
        var arrivals = projection.Select(p => new ArrivalRequest(p.Code, d.Time.AddSeconds(p.DelaySeconds).Nanoseconds / 1_000_000_000m, d.Snrs[d.SiteCodes.ToList().IndexOf(p.Code)])).ToList();
        return new OpenCaseRequest(d.CandidateId, d.Time.Nanoseconds / 1_000_000_000m, "demo-matched-filter", summary, arrivals, checklist);
    }

    private static ClaimsPrincipal Principal(AppUser user, string role) => new(new ClaimsIdentity(
    [
        new Claim(ClaimTypes.NameIdentifier, user.Id),
        new Claim(ClaimTypes.Name, user.Email!),
        new Claim(UserClaims.DisplayName, user.DisplayName),
        new Claim(ClaimTypes.Role, role),
    ], "demo-seed"));
}
