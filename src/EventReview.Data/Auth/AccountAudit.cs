using EventReview.Core.Records;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Logging;

namespace EventReview.Data.Auth;

/// <summary>
/// Appends to and reads the sign-in audit (<see cref="AccountEvent"/>). Appends are serialised in this process and
/// retried when another process took the same sequence number, so the chain has no gaps or forks.
/// </summary>
public sealed partial class AccountAudit(IDbContextFactory<AppDbContext> dbFactory, TimeProvider clock, ILogger<AccountAudit> log)
{
    private static readonly SemaphoreSlim Gate = new(1, 1);

    /// <summary>Appends one entry (with the <paramref name="facts"/> of what it changed); never pass a password or a token secret in any field.</summary>
    public async Task RecordAsync(string kind, string? userId, string? account, string? address, string? detail = null,
        IEnumerable<Fact>? facts = null, CancellationToken ct = default)
    {
        if (kind is AccountEventKinds.SignInSucceeded or AccountEventKinds.SignInFailed or AccountEventKinds.LockedOut)
        {
            Telemetry.ReviewMetrics.SignIn(kind == AccountEventKinds.SignInSucceeded);
        }

        await Gate.WaitAsync(ct);
        try
        {
            for (var attempt = 1; ; attempt++)
            {
                await using var db = await dbFactory.CreateDbContextAsync(ct);
                await AddNextAsync(db, kind, userId, account, address, detail, facts, ct);
                try
                {
                    await db.SaveChangesAsync(ct);
                    LogAccountEvent(log, kind, account ?? "(none)", address ?? "(unknown)");
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

    /// <summary>
    /// Holds the audit's append lock for a change that will record itself with <see cref="RecordInAsync"/>. Take it
    /// before the change's transaction writes anything: appends are serialised by this lock first and the database's
    /// write lock second, always in that order, so two of them can never wait on each other.
    /// </summary>
    public async Task<IAsyncDisposable> HoldAsync(CancellationToken ct = default)
    {
        await Gate.WaitAsync(ct);
        return new Held();
    }

    /// <summary>
    /// Appends one entry through <paramref name="db"/> and saves it there, so that it commits with the change it records
    /// (the caller's transaction on that context). The caller holds <see cref="HoldAsync"/>. Throws what the save
    /// throws; the caller's transaction then rolls back.
    /// </summary>
    public async Task RecordInAsync(AppDbContext db, string kind, string? userId, string? account, string? address, string? detail,
        IEnumerable<Fact> facts, CancellationToken ct = default)
    {
        ArgumentNullException.ThrowIfNull(db);
        await AddNextAsync(db, kind, userId, account, address, detail, facts, ct);
        await db.SaveChangesAsync(ct);
        LogAccountEvent(log, kind, account ?? "(none)", address ?? "(unknown)");
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Account event {Kind} for {Account} from {Address}")]
    private static partial void LogAccountEvent(ILogger logger, string kind, string account, string address);

    private sealed class Held : IAsyncDisposable
    {
        private int _released;

        public ValueTask DisposeAsync()
        {
            if (Interlocked.Exchange(ref _released, 1) == 0)
            {
                Gate.Release();
            }

            return ValueTask.CompletedTask;
        }
    }

    private async Task AddNextAsync(AppDbContext db, string kind, string? userId, string? account, string? address, string? detail, IEnumerable<Fact>? facts, CancellationToken ct)
    {
        var last = await db.AccountEvents.AsNoTracking().OrderByDescending(e => e.Sequence).Select(e => new { e.Sequence, e.Hash }).FirstOrDefaultAsync(ct);
        db.AccountEvents.Add(AccountEvent.Next((last?.Sequence ?? 0) + 1, last?.Hash ?? AccountEvent.GenesisHash, clock.GetUtcNow(), kind, userId, account, address, detail, facts));
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
        var (problem, last) = await WalkAsync(db, null, ct);
        _verified = problem is null && last is { } l ? new Verified(l.Item1, l.Item2) : null;
        return problem;
    }

    /// <summary>
    /// Like <see cref="FirstProblemAsync"/>, but after one whole walk by this process it checks only that the newest
    /// entry it verified is unchanged and walks the entries added since (the Team page; a busy team's record grows by
    /// thousands of entries a week). The whole chain is still walked by the integrity check and <c>eventreview verify</c>.
    /// </summary>
    public async Task<string?> FirstProblemSinceLastCheckAsync(CancellationToken ct = default)
    {
        if (Volatile.Read(ref _verified) is not { } from)
        {
            return await FirstProblemAsync(ct);
        }

        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var (problem, last) = await WalkAsync(db, (from.Sequence, from.Hash), ct);
        Volatile.Write(ref _verified, problem is null && last is { } l ? new Verified(l.Item1, l.Item2) : null);
        return problem;
    }

    /// <summary>The newest entry this process has verified (with every entry before it), or null.</summary>
    private Verified? _verified;

    private sealed record Verified(long Sequence, string Hash);

    /// <summary>The same walk over the sign-in audit of <paramref name="db"/> (used by the whole-record verification).</summary>
    public static async Task<string?> FirstProblemInAsync(AppDbContext db, CancellationToken ct = default) => (await WalkAsync(db, null, ct)).Problem;

    /// <summary>
    /// Walks the chain from the start, or from <paramref name="from"/> (an entry verified before, which must still be
    /// there with the same hash); returns the first problem and the newest entry walked.
    /// </summary>
    private static async Task<(string? Problem, (long, string)? Last)> WalkAsync(AppDbContext db, (long Sequence, string Hash)? from, CancellationToken ct)
    {
        var prev = AccountEvent.GenesisHash;
        long expected = 1;
        var query = db.AccountEvents.AsNoTracking();
        if (from is { } f)
        {
            var anchor = await query.FirstOrDefaultAsync(e => e.Sequence == f.Sequence, ct);
            if (anchor is null || !string.Equals(anchor.Hash, f.Hash, StringComparison.Ordinal) || !anchor.HashMatches())
            {
                return ($"Sign-in audit entry {f.Sequence} was altered or removed after it was verified.", null);
            }

            prev = f.Hash;
            expected = f.Sequence + 1;
            query = query.Where(e => e.Sequence > f.Sequence);
        }

        (long, string)? last = from;
        await foreach (var e in query.OrderBy(e => e.Sequence).AsAsyncEnumerable().WithCancellation(ct))
        {
            if (e.Sequence != expected)
            {
                return ($"Sign-in audit entry {expected} is missing.", null);
            }

            if (!string.Equals(e.PreviousHash, prev, StringComparison.Ordinal) || !e.HashMatches())
            {
                return ($"Sign-in audit entry {e.Sequence} ({e.Kind}) was altered or does not link to the entry before it.", null);
            }

            prev = e.Hash;
            expected++;
            last = (e.Sequence, e.Hash);
        }

        return (null, last);
    }
}
