using EventReview.Data;
using EventReview.Data.Notifications;
using EventReview.Data.Writes;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Notifications;

/// <summary>
/// One pass of the notification worker: read the timeline since last time (<see cref="TimelineNotices"/>), look at due
/// dates (<see cref="DueNotices"/>), route what waits (<see cref="NotificationRouter"/>) and send what is due
/// (<see cref="OutboxSender"/>). Each step stores its result before the next; a step that fails is logged and tried
/// again next pass. Time comes from the injected <see cref="TimeProvider"/>, so tests decide what "tomorrow" is.
/// </summary>
public sealed class NotificationPump(
    IDbContextFactory<AppDbContext> dbFactory,
    IWriteGate writes,
    DatabaseSettings database,
    NotificationRouter router,
    OutboxSender sender,
    TimeProvider clock,
    ILogger<NotificationPump> log) : IDisposable
{
    private readonly SemaphoreSlim _one = new(1, 1);

    /// <summary>Releases the pass lock (the container disposes the singleton at shutdown).</summary>
    public void Dispose() => _one.Dispose();

    /// <summary>Result of one pass.</summary>
    public sealed record Pass(int Notices, int Messages, int Sent, int Failed);

    /// <summary>Runs one pass (passes never overlap in this process).</summary>
    public async Task<Pass> RunOnceAsync(CancellationToken ct = default)
    {
        await _one.WaitAsync(ct);
        try
        {
            var notices = await Step("read the timeline", () => CollectTimelineAsync(ct));
            notices += await Step("look at due dates", () => CollectDueAsync(ct));
            var messages = await Step("route notifications", () => RouteAsync(ct));
            var (sent, failed) = await Step("send messages", () => sender.SendDueAsync(clock.GetUtcNow(), ct));
            return new Pass(notices, messages, sent, failed);
        }
        finally
        {
            _one.Release();
        }
    }

    private async Task<int> CollectTimelineAsync(CancellationToken ct)
    {
        var total = 0;
        for (var round = 0; round < 10; round++)
        {
            var now = clock.GetUtcNow();

            // On a database server a later id can commit before an earlier one: look only at entries a few seconds old.
            var settled = database.Provider == DatabaseProvider.Postgres ? now.AddSeconds(-3) : now;
            await using var db = await dbFactory.CreateDbContextAsync(ct);
            var cursor = await db.NotificationCursors.FirstOrDefaultAsync(c => c.Name == NotificationCursor.Timeline, ct);
            if (cursor is null)
            {
                // First start: begin at the end of the timeline (nothing from before notifications existed is told).
                var end = await db.Timeline.MaxAsync(a => (long?)a.Id, ct) ?? 0;
                db.NotificationCursors.Add(NotificationCursor.Start(NotificationCursor.Timeline, end));
                await writes.SaveAsync(db, ct);
                return total;
            }

            var (notices, upto, scanned) = await TimelineNotices.CollectAsync(db, cursor.Position, settled, now, ct);
            if (scanned == 0)
            {
                return total;
            }

            total += await NotificationInbox.AddNewAsync(db, notices, ct);
            cursor.MoveTo(upto);
            await writes.SaveAsync(db, ct);
            if (scanned < TimelineNotices.Batch)
            {
                return total;
            }
        }

        return total;
    }

    private async Task<int> CollectDueAsync(CancellationToken ct)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var added = await NotificationInbox.AddNewAsync(db, await DueNotices.CollectAsync(db, clock.GetUtcNow(), ct), ct);
        if (added > 0)
        {
            await writes.SaveAsync(db, ct);
        }

        return added;
    }

    private async Task<int> RouteAsync(CancellationToken ct)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var made = await router.RouteAsync(db, clock.GetUtcNow(), ct);
        await writes.SaveAsync(db, ct);
        return made;
    }

    private async Task<T> Step<T>(string what, Func<Task<T>> step)
    {
        try
        {
            return await step();
        }
        catch (DbUpdateException ex)
        {
            // Another instance did the same work at the same moment (unique keys, concurrency tokens): next pass.
            log.LogInformation("Notifications: could not {Step} this pass ({Reason}); trying again next pass", what, ex.InnerException?.Message ?? ex.Message);
            return default!;
        }
    }
}
