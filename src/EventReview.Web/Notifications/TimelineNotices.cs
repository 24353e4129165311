using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Notifications;
using EventReview.Data;
using EventReview.Data.Notifications;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Notifications;

/// <summary>
/// Reads the timelines (every case's entries, in id order, from where the last pass stopped) and turns the entries
/// people must hear about into notifications: an item assigned to someone, sign-offs gone stale, the last item of a
/// case signed off. The timeline is the durable source: nothing said there is missed, and the review action that wrote
/// it never waits for a notification.
/// </summary>
public static class TimelineNotices
{
    /// <summary>Entries looked at per query.</summary>
    public const int Batch = 20_000;

    private static readonly string[] Kinds = ["item.assigned", "signoff.stale", "signoff"];

    /// <summary>
    /// The notifications of the entries after <paramref name="from"/> written before <paramref name="settledBefore"/>
    /// (on a database server, entries of transactions still committing could otherwise be passed over), and the id of
    /// the last entry looked at, and how many entries were looked at (<see cref="Batch"/> at most).
    /// </summary>
    public static async Task<(List<Notification> Notices, long Upto, int Scanned)> CollectAsync(AppDbContext db, long from, DateTimeOffset settledBefore, DateTimeOffset now, CancellationToken ct)
    {
        var ids = await db.Timeline.AsNoTracking().Where(a => a.Id > from && a.At <= settledBefore)
            .OrderBy(a => a.Id).Select(a => a.Id).Take(Batch).ToListAsync(ct);
        if (ids.Count == 0)
        {
            return ([], from, 0);
        }

        var upto = ids[^1];
        var entries = await db.Timeline.AsNoTracking().Where(a => a.Id > from && a.Id <= upto && Kinds.Contains(a.Kind)).OrderBy(a => a.Id).ToListAsync(ct);
        var notices = new List<Notification>();
        foreach (var e in entries)
        {
            var c = await db.Cases.AsNoTracking().Where(x => x.Id == e.ReviewCaseId).Select(x => new { x.Id, x.CandidateId, x.State, x.CoordinatorId }).FirstAsync(ct);
            if (c.State == CaseState.Closed)
            {
                continue;
            }

            var item = e.ItemKey is null ? null : await db.Items.AsNoTracking().FirstOrDefaultAsync(i => i.ReviewCaseId == c.Id && i.Key == e.ItemKey, ct);
            switch (e.Kind)
            {
                case "item.assigned" when item?.OwnerId is { } owner && owner != e.ActorId
                    && !await db.Timeline.AnyAsync(a => a.ReviewCaseId == c.Id && a.ItemKey == e.ItemKey && a.Kind == "item.assigned" && a.Id > e.Id, ct):
                    notices.Add(Notification.Create(owner, NotificationKind.Assigned, c.Id, item.Key,
                        $"{c.CandidateId}: '{item.Title}' assigned to you",
                        $"{e.ActorName} assigned you the checklist item '{item.Title}' ({item.Key}) of case {c.CandidateId}" +
                        (item.DueDate is { } due ? $", due {due:yyyy-MM-dd} (UTC)." : ".") + " Open it for its guidance and evidence.",
                        ItemLink(c.Id, item.Key), $"{NotificationKind.Assigned}:{owner}:{e.Id}", now));
                    break;
                case "signoff.stale" when item is not null:
                    var stale = await db.SignOffs.AsNoTracking()
                        .Where(s => s.ChecklistItemId == item.Id && s.IsStale && s.StaleSince >= e.At.AddSeconds(-1) && s.StaleSince <= e.At.AddSeconds(1))
                        .Select(s => new { s.Id, s.UserId }).ToListAsync(ct);
                    notices.AddRange(stale.Where(s => s.UserId != e.ActorId).Select(s => Notification.Create(s.UserId, NotificationKind.StaleSignOff, c.Id, item.Key,
                        $"{c.CandidateId}: your sign-off of '{item.Title}' is stale",
                        $"{e.ActorName} added to the evidence of '{item.Title}' ({item.Key}) of case {c.CandidateId} at {e.At.UtcDateTime:yyyy-MM-dd HH:mm} UTC, after you signed it. " +
                        "Your sign-off no longer counts: review what changed (the item's timeline) and sign again.",
                        ItemLink(c.Id, item.Key), $"{NotificationKind.StaleSignOff}:{s.UserId}:{s.Id}", now)));
                    break;
                case "signoff" when c.State is CaseState.Open or CaseState.InReview:
                    notices.AddRange(await ReadyAsync(db, c.Id, c.CandidateId, c.CoordinatorId, now, ct));
                    break;
            }
        }

        return (notices, upto, ids.Count);
    }

    /// <summary>When every item of the case is signed off: its coordinator (or, for a case a pipeline opened, every coordinator) is told.</summary>
    private static async Task<IEnumerable<Notification>> ReadyAsync(AppDbContext db, int caseId, string candidateId, string coordinatorId, DateTimeOffset now, CancellationToken ct)
    {
        var states = await db.Items.AsNoTracking().Where(i => i.ReviewCaseId == caseId).Select(i => i.State).ToListAsync(ct);
        if (states.Count == 0 || states.Any(s => s != ItemState.SignedOff))
        {
            return [];
        }

        var lastSignOff = await db.Timeline.Where(a => a.ReviewCaseId == caseId && a.Kind == "signoff").MaxAsync(a => a.Id, ct);
        var recipients = await db.Users.AnyAsync(u => u.Id == coordinatorId, ct) ? [coordinatorId] : await NotificationInbox.CoordinatorIdsAsync(db, ct);
        return recipients.Select(r => Notification.Create(r, NotificationKind.ReadyForDecision, caseId, null,
            $"{candidateId}: every item is signed off, ready for decision",
            $"All {states.Count} checklist items of case {candidateId} are signed off with current sign-offs. The case can be submitted to the decision board for decision; " +
            "the decision rests with the decision board, under its own procedures.",
            $"/cases/{caseId}", $"{NotificationKind.ReadyForDecision}:{r}:{caseId}:{lastSignOff}", now));
    }

    private static string ItemLink(int caseId, string key) => $"/cases/{caseId}/items/{Uri.EscapeDataString(key)}";
}
