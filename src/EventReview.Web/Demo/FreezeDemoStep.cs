using EventReview.Core.Evidence;
using EventReview.Core.Time;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Demo;

/// <summary>
/// Gives the flagship demo candidate (ER-C-0142) a frozen configuration record at each of its sites and has two reviewers
/// sign the freeze item, so that a new user (and the tamper tests) see the protected parts in use: the frozen records, their
/// fingerprints and the sign-offs bound to them. The configuration items and values are invented.
/// </summary>
public sealed class FreezeDemoStep(ConfigurationService configurations, CaseQueries cases, CaseWorkflow workflow) : IDemoSeedStep
{
    public int Order => 70;

    public async Task SeedAsync(DemoContext demo, CancellationToken ct)
    {
        var id = demo.CaseIds["ER-C-0142"];
        var c = await cases.GetAsync(demo.Coordinator, id, ct);
        var at = GpsUtc.ToUtc(c.Gps).DateTimeUtc;
        var from = new DateTimeOffset(at.AddHours(-1), TimeSpan.Zero);
        var until = new DateTimeOffset(at.AddDays(14), TimeSpan.Zero);
        var firmware = 7;
        foreach (var site in c.Arrivals.Select(a => a.SiteCode).Order(StringComparer.Ordinal))
        {
            firmware++;
            var text = string.Join('\n',
                $"daq.firmware = 4.{firmware}.2",
                "control.software = ctrl-2031.04",
                $"calibration.version = {site}-C17",
                $"filters.whitening.sha256 = {Hashing.Sha256Hex($"demo whitening filter of {site}")}",
                $"channels.list = {site}/strain/main-readout {site}/env/seismometer-central-hall-floor/x {site}/env/magnetometer-electronics-vault/y",
                $"seal.rack-2 = S-{20400 + firmware}");
            var snapshot = await configurations.CaptureAsync(demo.Coordinator, c, site, "as at the candidate time", text, $"{site.ToLowerInvariant()}-config.txt", ct);
            c = await configurations.FreezeAsync(demo.Coordinator, c, snapshot.Id, from, until, "Candidate ER-C-0142 under review: no changes to the instrument until the review closes.", ct);
        }

        c = await workflow.TransitionAsync(demo.ReviewerA, id, "freeze.record", "ready", null, ct);
        c = await workflow.SignAsync(demo.ReviewerB, id, "freeze.record", SignOffMeaning.Reviewed,
            "Compared the three frozen records with the site logs: complete, seals as placed.", c.Item("freeze.record").Fingerprint(), DemoAccounts.Proof(demo.ReviewerB), ct);
        await workflow.SignAsync(demo.Coordinator, id, "freeze.record", SignOffMeaning.Approved,
            "Freeze in force at every site until the review closes.", c.Item("freeze.record").Fingerprint(), DemoAccounts.Proof(demo.Coordinator), ct);
    }
}
