using System.Security.Claims;
using EventReview.Core.Evidence;
using EventReview.Web.Auth;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Services;

/// <summary>Reads of an item's computation records (what the dossier holds beside evidence and sign-offs).</summary>
public sealed partial class CaseService
{
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

/// <summary>One page of an item's computation records, oldest first; <paramref name="CurrentIds"/> holds the newest record of each kind.</summary>
public sealed record ComputationPage(int Total, int Offset, int Limit, IReadOnlyList<ComputationRecord> Records, IReadOnlySet<int> CurrentIds);
