using System.Security.Claims;
using EventReview.Core.Network;
using EventReview.Data;
using EventReview.Web.Auth;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Services;

/// <summary>The detector network: read by everyone, edited by coordinators.</summary>
public sealed class NetworkService(IDbContextFactory<AppDbContext> dbFactory)
{
    /// <summary>The network (an empty one named "network" when none is stored yet).</summary>
    public async Task<DetectorNetwork> GetAsync(CancellationToken ct = default)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await db.Networks.Include(n => n.Sites).AsNoTracking().FirstOrDefaultAsync(ct) ?? new DetectorNetwork("network");
    }

    /// <summary>Adds or updates a site by code (all fields validated by <see cref="Site"/>; nothing stored on error).</summary>
    public async Task SaveSiteAsync(ClaimsPrincipal user, string? originalCode, string code, string name, double lat, double lon, double height,
        double xAz, double yAz, double sigma, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "edit the network");
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var network = await db.Networks.Include(n => n.Sites).FirstOrDefaultAsync(ct);
        if (network is null)
        {
            network = new DetectorNetwork("network");
            db.Networks.Add(network);
        }

        var existing = originalCode is null ? null : network.Find(originalCode);
        if (existing is null)
        {
            network.Add(new Site(code, name, lat, lon, height, xAz, yAz, sigma));
        }
        else
        {
            var clash = network.Find(code);
            if (clash is not null && !ReferenceEquals(clash, existing))
            {
                throw new ArgumentException($"Site code {code} is already used by {clash.Name}.", nameof(code));
            }

            existing.Update(code, name, lat, lon, height, xAz, yAz, sigma);
        }

        await db.SaveChangesAsync(ct);
    }

    /// <summary>Replaces the whole network (e.g. from an imported file).</summary>
    public async Task ReplaceAsync(ClaimsPrincipal user, string name, IReadOnlyList<Site> sites, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Coordinate, "edit the network");
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        await NetworkStore.ReplaceAsync(db, name, sites, ct);
    }
}
