using System.Globalization;
using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;
using EventReview.Core.Verdicts;
using EventReview.Data;
using EventReview.Web.Auth;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Configuration snapshots per site: capture (from a file or typed), freeze for a case (coordinators), and drift of later
/// snapshots against the frozen one. Freezing stores a "configuration" computation record on the case's first configuration
/// item (so sign-offs bind to the frozen record's fingerprint); a later capture for a site with a frozen record stores a
/// drift record on the last configuration item, with verdict "no drift", "drift" (outside the freeze period) or "concern".
/// </summary>
public sealed class ConfigurationService(IDbContextFactory<AppDbContext> dbFactory, CaseWorkflow workflow, TimeProvider clock)
{
    /// <summary>Snapshots of the case's sites (the case's own and any captured for those sites), newest first.</summary>
    public async Task<IReadOnlyList<ConfigurationSnapshot>> ListAsync(ClaimsPrincipal user, ReviewCase c, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read configuration records");
        var sites = c.Arrivals.Select(a => a.SiteCode).ToList();
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var list = await db.ConfigurationSnapshots.AsNoTracking().Where(s => s.ReviewCaseId == c.Id || sites.Contains(s.SiteCode)).ToListAsync(ct);
        return list.OrderByDescending(s => s.CapturedAt).ThenByDescending(s => s.Id).ToList();
    }

    /// <summary>The drift of every later snapshot of a site against each frozen snapshot of this case.</summary>
    public static IReadOnlyList<(ConfigurationSnapshot Frozen, ConfigurationSnapshot Later, DriftReport Report)> Drifts(ReviewCase c, IReadOnlyList<ConfigurationSnapshot> snapshots) =>
        snapshots.Where(f => f.IsFrozen && f.ReviewCaseId == c.Id)
            .SelectMany(f => snapshots.Where(l => l.SiteCode == f.SiteCode && l.Id != f.Id && l.CapturedAt > f.CapturedAt)
                .Select(l => (f, l, DriftCheck.Run(f, l))))
            .OrderByDescending(d => d.l.CapturedAt)
            .ToList();

    /// <summary>Captures a snapshot from text in the import formats (key = value lines or JSON).</summary>
    /// <exception cref="FormatException">When the text does not parse (names the line); nothing is stored.</exception>
    public async Task<ConfigurationSnapshot> CaptureAsync(ClaimsPrincipal user, ReviewCase c, string siteCode, string label, string text, string fileName, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "capture configuration records");
        if (c.Arrivals.All(a => a.SiteCode != siteCode))
        {
            throw new ArgumentException($"Site '{siteCode}' has no arrival in case {c.CandidateId}.", nameof(siteCode));
        }

        var items = ConfigurationImport.Parse(text, fileName);
        if (items.Count == 0)
        {
            throw new FormatException($"{fileName}: no configuration items found.");
        }

        var actor = user.ToActor();
        var snapshot = ConfigurationSnapshot.Capture(siteCode, string.IsNullOrWhiteSpace(label) ? fileName : label.Trim(), items, actor, EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow()), c.Id);
        await using (var db = await dbFactory.CreateDbContextAsync(ct))
        {
            db.ConfigurationSnapshots.Add(snapshot);
            await db.SaveChangesAsync(ct);
        }

        var all = await ListAsync(user, c, ct);
        var frozen = all.Where(s => s.IsFrozen && s.ReviewCaseId == c.Id && s.SiteCode == siteCode).ToList();
        var driftItem = c.Items.LastOrDefault(i => i.CheckKind == CheckKind.Configuration);
        if (driftItem is not null && frozen.Count > 0 && c.State != CaseState.Closed)
        {
            foreach (var f in frozen)
            {
                var report = DriftCheck.Run(f, snapshot);
                var parameters = CheckRecords.Serialize(new { site = siteCode, frozenId = f.Id, frozenFingerprint = f.Fingerprint, laterId = snapshot.Id });
                var input = CheckRecords.Fingerprint(new { frozen = f.Fingerprint, later = snapshot.ItemsJson });
                await workflow.AddComputationAsync(user, c.Id, driftItem.Key, now => new ComputationRecord(CheckKind.Configuration, parameters, input, CheckRecords.ToolVersion,
                    CheckRecords.Serialize(new DriftRecordResult(RecordFormat.Current, report)), report.Verdict, report.Summary, string.Empty, actor, now), ct);
            }
        }

        return snapshot;
    }

    /// <summary>Freezes a snapshot for the case (coordinators) and records it on the case's first configuration item.</summary>
    public async Task<ReviewCase> FreezeAsync(ClaimsPrincipal user, ReviewCase c, int snapshotId, DateTimeOffset from, DateTimeOffset until, string reason, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "freeze configuration records");
        var item = c.Items.FirstOrDefault(i => i.CheckKind == CheckKind.Configuration)
            ?? throw new ArgumentException($"Case {c.CandidateId}'s checklist has no configuration item to record the freeze on.", nameof(c));
        var actor = user.ToActor();
        return await workflow.AddComputationWithAsync(user, Policies.Coordinate, c.Id, item.Key, async (db, rc, now) =>
        {
            var snapshot = await db.ConfigurationSnapshots.FirstOrDefaultAsync(s => s.Id == snapshotId, ct)
                ?? throw new KeyNotFoundException($"There is no configuration record with id {snapshotId}.");
            snapshot.Freeze(rc.Id, EventReview.Core.Time.RecordedTime.Normalize(from), EventReview.Core.Time.RecordedTime.Normalize(until), reason, actor, now);
            var result = new
            {
                site = snapshot.SiteCode,
                label = snapshot.Label,
                fingerprint = snapshot.Fingerprint,
                freezeFrom = snapshot.FreezeFrom,
                freezeUntil = snapshot.FreezeUntil,
                reason = snapshot.FreezeReason,
                itemCount = snapshot.Items.Count,
                items = snapshot.Items,
            };
            var summary = string.Create(CultureInfo.InvariantCulture,
                $"{snapshot.SiteCode} configuration '{snapshot.Label}' frozen ({snapshot.Items.Count} items) from {snapshot.FreezeFrom:yyyy-MM-dd HH:mm} to {snapshot.FreezeUntil:yyyy-MM-dd HH:mm} UTC; fingerprint {snapshot.Fingerprint![..16]}…");
            return (new ComputationRecord(CheckKind.Configuration, CheckRecords.Serialize(new { snapshotId, from, until, reason }),
                snapshot.Fingerprint!, CheckRecords.ToolVersion, CheckRecords.Serialize(result), VerdictWords.Word(Verdict.Frozen), summary, string.Empty, actor, now), snapshot);
        }, ct);
    }
}
