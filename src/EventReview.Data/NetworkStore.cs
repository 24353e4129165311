using EventReview.Core.Network;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>The stored detector network, shared by the app's network page and <c>eventreview network import/export</c>.</summary>
public static class NetworkStore
{
    /// <summary>The network as stored (an empty one named "network" when none is stored yet), sites by code.</summary>
    public static async Task<NetworkDefinition> ReadAsync(AppDbContext db, CancellationToken ct = default)
    {
        var n = await db.Networks.Include(x => x.Sites).AsNoTracking().FirstOrDefaultAsync(ct) ?? new DetectorNetwork("network");
        return new NetworkDefinition(n.Name, n.Sites.OrderBy(s => s.Code, StringComparer.Ordinal).ToList());
    }

    /// <summary>Replaces the whole network in one transaction: either every site is stored or nothing changes.</summary>
    /// <exception cref="ArgumentException">When the name is empty or site codes repeat (nothing is changed).</exception>
    public static async Task ReplaceAsync(AppDbContext db, string name, IReadOnlyList<Site> sites, CancellationToken ct = default)
    {
        var fresh = new DetectorNetwork(name);
        foreach (var s in sites)
        {
            fresh.Add(new Site(s.Code, s.Name, s.LatitudeDegrees, s.LongitudeDegrees, s.HeightMeters, s.XArmAzimuthDegrees, s.YArmAzimuthDegrees, s.TimingUncertaintySeconds));
        }

        await using var tx = await db.Database.BeginTransactionAsync(ct);
        var old = await db.Networks.Include(n => n.Sites).ToListAsync(ct);
        db.Networks.RemoveRange(old);
        await db.SaveChangesAsync(ct);
        db.Networks.Add(fresh);
        await db.SaveChangesAsync(ct);
        await tx.CommitAsync(ct);
    }
}
