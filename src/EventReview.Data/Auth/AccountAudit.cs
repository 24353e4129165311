using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Logging;

namespace EventReview.Data.Auth;

/// <summary>
/// Appends to and reads the sign-in audit (<see cref="AccountEvent"/>). Appends are serialised in this process and
/// retried when another process took the same sequence number, so the chain has no gaps or forks.
/// </summary>
public sealed class AccountAudit(IDbContextFactory<AppDbContext> dbFactory, TimeProvider clock, ILogger<AccountAudit> log)
{
    private static readonly SemaphoreSlim Gate = new(1, 1);

    /// <summary>Appends one entry; never pass a password or a token secret in any field.</summary>
    public async Task RecordAsync(string kind, string? userId, string? account, string? address, string? detail = null, CancellationToken ct = default)
    {
        await Gate.WaitAsync(ct);
        try
        {
            for (var attempt = 1; ; attempt++)
            {
                await using var db = await dbFactory.CreateDbContextAsync(ct);
                var last = await db.AccountEvents.AsNoTracking().OrderByDescending(e => e.Sequence).Select(e => new { e.Sequence, e.Hash }).FirstOrDefaultAsync(ct);
                db.AccountEvents.Add(AccountEvent.Next((last?.Sequence ?? 0) + 1, last?.Hash ?? AccountEvent.GenesisHash, clock.GetUtcNow(), kind, userId, account, address, detail));
                try
                {
                    await db.SaveChangesAsync(ct);
                    log.LogInformation("Account event {Kind} for {Account} from {Address}", kind, account ?? "(none)", address ?? "(unknown)");
                    return;
                }
                catch (DbUpdateException) when (attempt < 5)
                {
                    // Another process appended the same sequence number first: read the new end of the chain and retry.
                }
            }
        }
        finally
        {
            Gate.Release();
        }
    }

    /// <summary>One page of entries, newest first, and the total count.</summary>
    public async Task<(IReadOnlyList<AccountEvent> Page, int Total)> PageAsync(int page, int pageSize, CancellationToken ct = default)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(page);
        ArgumentOutOfRangeException.ThrowIfLessThan(pageSize, 1);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var total = await db.AccountEvents.CountAsync(ct);
        var list = await db.AccountEvents.AsNoTracking().OrderByDescending(e => e.Sequence).Skip(page * pageSize).Take(pageSize).ToListAsync(ct);
        return (list, total);
    }

    /// <summary>Walks the whole chain; null when intact, else a sentence naming the first entry that does not verify.</summary>
    public async Task<string?> FirstProblemAsync(CancellationToken ct = default)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await FirstProblemInAsync(db, ct);
    }

    /// <summary>The same walk over the sign-in audit of <paramref name="db"/> (used by the whole-record verification).</summary>
    public static async Task<string?> FirstProblemInAsync(AppDbContext db, CancellationToken ct = default)
    {
        var prev = AccountEvent.GenesisHash;
        long expected = 1;
        await foreach (var e in db.AccountEvents.AsNoTracking().OrderBy(e => e.Sequence).AsAsyncEnumerable().WithCancellation(ct))
        {
            if (e.Sequence != expected)
            {
                return $"Sign-in audit entry {expected} is missing.";
            }

            if (!string.Equals(e.PreviousHash, prev, StringComparison.Ordinal) || !e.HashMatches())
            {
                return $"Sign-in audit entry {e.Sequence} ({e.Kind}) was altered or does not link to the entry before it.";
            }

            prev = e.Hash;
            expected++;
        }

        return null;
    }
}
