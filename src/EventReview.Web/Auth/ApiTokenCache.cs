using System.Collections.Concurrent;
using EventReview.Data;
using EventReview.Data.Auth;
using EventReview.Data.Writes;
using EventReview.Web.Operations;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Auth;

/// <summary>
/// Remembers checked API tokens for a few seconds (<see cref="OperationsOptions.TokenCacheSeconds"/>), so that a
/// pipeline sending many requests is not read from the database on each, and records "last used" at most once a
/// minute per token. Entries are kept by the token's hash, never its secret; a revocation in this process (the Tokens
/// page) makes every entry be read again.
/// </summary>
public sealed class ApiTokenCache(IDbContextFactory<AppDbContext> dbFactory, IWriteGate writes, TimeProvider clock, TokenRevocations revocations, IOptions<OperationsOptions> options)
{
    private const int MaxEntries = 10_000;
    private static readonly TimeSpan TouchEvery = TimeSpan.FromMinutes(1);

    private readonly ConcurrentDictionary<string, Entry> _entries = new(StringComparer.Ordinal);
    private readonly TimeSpan _keep = TimeSpan.FromSeconds(Math.Max(0, options.Value.TokenCacheSeconds));

    /// <summary>The token with this hash as stored (at most the cache time old), or null when there is none.</summary>
    public async Task<ApiToken?> FindAsync(string hash, CancellationToken ct)
    {
        var now = clock.GetUtcNow();
        var generation = revocations.Generation;
        if (_keep > TimeSpan.Zero && _entries.TryGetValue(hash, out var kept) && now - kept.ReadAt < _keep && kept.Generation == generation)
        {
            return kept.Token;
        }

        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var token = await db.ApiTokens.AsNoTracking().FirstOrDefaultAsync(t => t.Hash == hash, ct);
        if (token is not null && _keep > TimeSpan.Zero)
        {
            if (_entries.Count >= MaxEntries)
            {
                _entries.Clear();
            }

            _entries[hash] = new Entry(token, now, generation);
        }

        return token;
    }

    /// <summary>Records that <paramref name="token"/> was used now, unless that was recorded less than a minute ago.</summary>
    public async Task TouchAsync(ApiToken token, CancellationToken ct)
    {
        var now = clock.GetUtcNow();
        var last = _entries.TryGetValue(token.Hash, out var kept) && kept.TouchedAt is { } t ? t : token.LastUsedAt;
        if (last is not null && now - last <= TouchEvery)
        {
            return;
        }

        if (kept is not null)
        {
            _entries[token.Hash] = kept with { TouchedAt = now };
        }

        await writes.RunSqlAsync(async (unit, token2) =>
        {
            var update = unit.Bound("""UPDATE "ApiTokens" SET "LastUsedAt" = @at WHERE "Id" = @id""", ("@at", unit.Time(now)), ("@id", token.Id));
            return await update.ExecuteNonQueryAsync(token2);
        }, ct);
    }

    private sealed record Entry(ApiToken Token, DateTimeOffset ReadAt, long Generation, DateTimeOffset? TouchedAt = null);
}
