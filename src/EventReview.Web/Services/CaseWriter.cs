using EventReview.Core.Cases;
using EventReview.Core.Time;
using EventReview.Data;
using EventReview.Data.Writes;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Services;

/// <summary>
/// How the case services save a change so that it is never lost to a race: load the case aggregate, apply one domain
/// method, hand the context to the writer; after a version conflict, read-change-save again inside the writer. Shared by
/// <see cref="CaseWorkflow"/> and <see cref="EvidenceAppender"/>; it checks no roles (its callers do).
/// </summary>
public sealed class CaseWriter(IDbContextFactory<AppDbContext> dbFactory, IWriteGate writes, TimeProvider clock)
{
    /// <summary>How often a change that met a conflict is tried in all.</summary>
    public const int MaxAttempts = 6;

    /// <summary>The message of a change that still conflicted after <see cref="MaxAttempts"/> tries.</summary>
    public const string BusyMessage = "The case is being changed by others right now and your change could not be saved; nothing was applied. Try again.";

    /// <summary>The current time as the record stores it (<see cref="RecordedTime.Normalize"/>).</summary>
    public DateTimeOffset Now() => RecordedTime.Normalize(clock.GetUtcNow());

    /// <summary>Loads the case, applies <paramref name="change"/> and saves; returns the case as saved.</summary>
    /// <param name="expectedItemVersion">When given, the item's version the caller saw; a different one is a conflict.</param>
    public Task<ReviewCase> MutateAsync(int caseId, string? itemKey, int? expectedItemVersion, Action<ReviewCase, DateTimeOffset> change, CancellationToken ct) =>
        MutateAsync(caseId, itemKey, expectedItemVersion, (_, c, now) =>
        {
            change(c, now);
            return Task.CompletedTask;
        }, ct);

    /// <summary>Like the other overload, for a change that also reads or changes other rows on the same context.</summary>
    public Task<ReviewCase> MutateAsync(int caseId, string? itemKey, int? expectedItemVersion, Func<AppDbContext, ReviewCase, DateTimeOffset, Task> change, CancellationToken ct) =>
        WriteAsync<ReviewCase>(async (db, token) =>
        {
            var c = await PrepareMutationAsync(db, caseId, itemKey, expectedItemVersion, change, token);
            return () => c;
        }, ct);

    /// <summary>
    /// One change, never lost to a race: first optimistically (read in parallel with others, then queue the save);
    /// after a conflict (someone changed the case between the read and the save), read-change-save again with no
    /// writer in between. <paramref name="prepare"/> reads and changes, and returns what to answer once saved.
    /// </summary>
    /// <exception cref="ConflictException">When the change still conflicts after <see cref="MaxAttempts"/> tries.</exception>
    public async Task<T> WriteAsync<T>(Func<AppDbContext, CancellationToken, Task<Func<T>>> prepare, CancellationToken ct)
    {
        for (var attempt = 1; ; attempt++)
        {
            try
            {
                if (attempt == 1)
                {
                    await using var db = await dbFactory.CreateDbContextAsync(ct);
                    var answer = await prepare(db, ct);
                    await writes.SaveAsync(db, ct);
                    return answer();
                }

                return await writes.RunAsync(async (db, token) =>
                {
                    var answer = await prepare(db, token);
                    await db.SaveChangesAsync(token);
                    return answer();
                }, ct);
            }
            catch (DbUpdateException) when (attempt < MaxAttempts)
            {
                await Task.Delay(Random.Shared.Next(1, 10) * attempt, ct);
            }
            catch (DbUpdateException)
            {
                throw new ConflictException(BusyMessage);
            }
        }
    }

    private async Task<ReviewCase> PrepareMutationAsync(AppDbContext db, int caseId, string? itemKey, int? expectedItemVersion,
        Func<AppDbContext, ReviewCase, DateTimeOffset, Task> change, CancellationToken ct)
    {
        var c = await db.CasesWithEverything().FirstOrDefaultAsync(x => x.Id == caseId, ct)
            ?? throw new KeyNotFoundException($"There is no case with id {caseId}.");
        if (itemKey is not null)
        {
            var item = c.Item(itemKey);
            if (expectedItemVersion is not null && item.Version != expectedItemVersion)
            {
                var last = c.Timeline.Where(a => a.ItemKey == itemKey).MaxBy(a => a.Sequence);
                throw new ConflictException($"Item '{itemKey}' was changed by {last?.ActorName ?? "someone else"} while you were editing it ({last?.Text}). Your change was not applied; the item has been reloaded — check it and apply your change again.");
            }
        }

        await change(db, c, Now());
        return c;
    }
}
