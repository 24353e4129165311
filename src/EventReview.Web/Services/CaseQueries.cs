using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Data;
using EventReview.Web.Auth;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Services;

/// <summary>
/// Every read of cases, for the UI and the API alike: lists, one case, its overview, and pages of evidence, computation
/// records and timeline. Roles are checked here on the server; nothing here changes anything.
/// </summary>
public sealed class CaseQueries(IDbContextFactory<AppDbContext> dbFactory)
{
    /// <summary>One page of the cases, newest candidate first, optionally filtered by state and text.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When offset or limit is out of range (see <see cref="Paging"/>).</exception>
    [System.Diagnostics.CodeAnalysis.SuppressMessage("Globalization", "CA1304", Justification = "EF Core translates ToLower() in the query to SQL lower(); no .NET culture is involved")]
    [System.Diagnostics.CodeAnalysis.SuppressMessage("Globalization", "CA1311", Justification = "EF Core translates ToLower() in the query to SQL lower(); no .NET culture is involved")]
    [System.Diagnostics.CodeAnalysis.SuppressMessage("Performance", "CA1862", Justification = "EF Core translates ToLower().Contains() to SQL; the StringComparison overload does not translate")]
    public async Task<CaseListPage> ListAsync(ClaimsPrincipal user, CaseState? state = null, string? search = null, int? offset = null, int? limit = null, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        var (o, l) = Paging.Check(offset, limit);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        IQueryable<ReviewCase> q = db.Cases.AsNoTracking();
        if (state is not null)
        {
            q = q.Where(c => c.State == state);
        }

        if (!string.IsNullOrWhiteSpace(search))
        {
            var s = search.Trim().ToLowerInvariant();
            q = q.Where(c => c.CandidateId.ToLower().Contains(s) || c.Summary.ToLower().Contains(s) || c.Search.ToLower().Contains(s));
        }

        var total = await q.CountAsync(ct);
        var page = await q.OrderByDescending(c => c.GpsNanoseconds).ThenByDescending(c => c.Id).Skip(o).Take(l)
            .Include(c => c.Arrivals)
            .Include(c => c.Items).ThenInclude(i => i.SignOffs)
            .AsSplitQuery()
            .ToListAsync(ct);
        return new CaseListPage(total, o, l, page);
    }

    /// <summary>A case with its items and sign-offs and per-item evidence counts and fingerprints, without evidence bodies or timeline.</summary>
    /// <exception cref="KeyNotFoundException">When there is no such case.</exception>
    public async Task<CaseOverview> GetOverviewAsync(ClaimsPrincipal user, int id, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var c = await db.Cases.AsNoTracking().Where(x => x.Id == id)
            .Include(x => x.Arrivals)
            .Include(x => x.Items).ThenInclude(i => i.SignOffs)
            .AsSplitQuery()
            .FirstOrDefaultAsync(ct)
            ?? throw new KeyNotFoundException($"There is no case with id {id}.");
        var evidence = await db.Evidence.AsNoTracking().Where(e => db.Items.Any(i => i.Id == e.ChecklistItemId && i.ReviewCaseId == id))
            .Select(e => new { e.Id, e.ChecklistItemId, e.Kind, e.ContentSha256, e.AddedAt })
            .ToListAsync(ct);
        var computations = await db.Computations.AsNoTracking().Where(r => db.Items.Any(i => i.Id == r.ChecklistItemId && i.ReviewCaseId == id))
            .Select(r => new { r.Id, r.ChecklistItemId, r.Kind, r.ParametersJson, r.InputFingerprint, r.ToolVersion, r.ResultJson, r.Verdict, r.RunAt })
            .ToListAsync(ct);
        var byItem = evidence.ToLookup(e => e.ChecklistItemId);
        var runsByItem = computations.ToLookup(r => r.ChecklistItemId);
        var summaries = c.Items.ToDictionary(i => i.Key, i =>
        {
            // Same canonical order as EvidenceFingerprint.Lines: time, then id.
            var lines = byItem[i.Id].OrderBy(e => e.AddedAt).ThenBy(e => e.Id)
                .Select(e => new EvidenceLine(EvidenceFingerprint.KindName(e.Kind), e.ContentSha256, e.AddedAt.UtcTicks)).ToList();
            var runs = runsByItem[i.Id].OrderBy(r => r.RunAt).ThenBy(r => r.Id)
                .Select(r => new ComputationLine(ComputationRecord.ComputeContentSha256(r.Kind, r.ParametersJson, r.InputFingerprint, r.ToolVersion, r.ResultJson, r.Verdict), r.RunAt.UtcTicks)).ToList();
            return new ItemEvidenceSummary(lines.Count, runs.Count, EvidenceFingerprint.Compute(lines, runs));
        });
        return new CaseOverview(c, summaries);
    }

    /// <summary>One page of an item's evidence, oldest first.</summary>
    /// <exception cref="KeyNotFoundException">When the case or item does not exist.</exception>
    public async Task<EvidencePage> EvidencePageAsync(ClaimsPrincipal user, int caseId, string itemKey, int? offset, int? limit, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        var (o, l) = Paging.Check(offset, limit);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var itemId = await ItemIdAsync(db, caseId, itemKey, ct);
        var q = db.Evidence.AsNoTracking().Where(e => e.ChecklistItemId == itemId);
        var total = await q.CountAsync(ct);
        var page = await q.OrderBy(e => e.Id).Skip(o).Take(l).ToListAsync(ct);
        return new EvidencePage(total, o, l, page);
    }

    /// <summary>One page of a case's timeline, newest first.</summary>
    /// <exception cref="KeyNotFoundException">When the case does not exist.</exception>
    public async Task<TimelinePage> TimelinePageAsync(ClaimsPrincipal user, int caseId, int? offset, int? limit, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        var (o, l) = Paging.Check(offset, limit);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        if (!await db.Cases.AnyAsync(c => c.Id == caseId, ct))
        {
            throw new KeyNotFoundException($"There is no case with id {caseId}.");
        }

        var q = db.Timeline.AsNoTracking().Where(a => a.ReviewCaseId == caseId);
        var total = await q.CountAsync(ct);
        var page = await q.OrderByDescending(a => a.Sequence).Skip(o).Take(l).ToListAsync(ct);
        return new TimelinePage(total, o, l, page);
    }

    internal static async Task<int> ItemIdAsync(AppDbContext db, int caseId, string itemKey, CancellationToken ct)
    {
        var id = await db.Items.Where(i => i.ReviewCaseId == caseId && i.Key == itemKey).Select(i => (int?)i.Id).FirstOrDefaultAsync(ct);
        if (id is not null)
        {
            return id.Value;
        }

        throw await db.Cases.AnyAsync(c => c.Id == caseId, ct)
            ? new KeyNotFoundException($"Case {caseId} has no checklist item '{itemKey}'.")
            : new KeyNotFoundException($"There is no case with id {caseId}.");
    }

    /// <summary>One case with everything in it.</summary>
    /// <exception cref="KeyNotFoundException">When there is no such case.</exception>
    public async Task<ReviewCase> GetAsync(ClaimsPrincipal user, int id, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await db.CasesWithEverything().AsNoTracking().FirstOrDefaultAsync(c => c.Id == id, ct)
            ?? throw new KeyNotFoundException($"There is no case with id {id}.");
    }

    /// <summary>
    /// One page of an item's computation records, oldest first, and the id of the newest record of each kind (the current
    /// one; older records stay as history).
    /// </summary>
    /// <exception cref="KeyNotFoundException">When the case or item does not exist.</exception>
    /// <exception cref="ArgumentOutOfRangeException">When offset or limit is out of range (see <see cref="Paging"/>).</exception>
    public async Task<ComputationPage> ComputationPageAsync(ClaimsPrincipal user, int caseId, string itemKey, int? offset, int? limit, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Read, "read cases");
        var (o, l) = Paging.Check(offset, limit);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var itemId = await ItemIdAsync(db, caseId, itemKey, ct);
        var q = db.Computations.AsNoTracking().Where(r => r.ChecklistItemId == itemId);
        var total = await q.CountAsync(ct);
        var page = await q.OrderBy(r => r.RunAt).ThenBy(r => r.Id).Skip(o).Take(l).ToListAsync(ct);
        var heads = await q.Select(r => new { r.Id, r.Kind, r.RunAt }).ToListAsync(ct);
        var current = heads.GroupBy(r => r.Kind).Select(g => g.OrderByDescending(r => r.RunAt).ThenByDescending(r => r.Id).First().Id).ToHashSet();
        return new ComputationPage(total, o, l, page, current);
    }
}
