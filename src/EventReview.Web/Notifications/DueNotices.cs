using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Notifications;
using EventReview.Data;
using EventReview.Data.Notifications;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Notifications;

/// <summary>
/// Items due tomorrow or today, and overdue items, of open cases, told to their owners: once per item and due date for
/// "due soon" and once for "overdue" (<see cref="DueRule"/>; due dates are UTC calendar days).
/// </summary>
public static class DueNotices
{
    public static async Task<List<Notification>> CollectAsync(AppDbContext db, DateTimeOffset now, CancellationToken ct)
    {
        var today = DueRule.UtcDay(now);
        var horizon = DueRule.NoticeHorizon(today);
        var items = await (from i in db.Items.AsNoTracking()
                           join c in db.Cases.AsNoTracking() on i.ReviewCaseId equals c.Id
                           where i.DueDate != null && i.DueDate <= horizon && i.OwnerId != null && i.State != ItemState.SignedOff && c.State != CaseState.Closed
                           select new { i.Id, CaseId = c.Id, c.CandidateId, i.Key, i.Title, i.DueDate, i.OwnerId, i.State }).ToListAsync(ct);
        var notices = new List<Notification>();
        foreach (var i in items)
        {
            var due = i.DueDate!.Value;
            var status = DueRule.Classify(due, today);
            var (kind, phrase) = status switch
            {
                DueStatus.Tomorrow => (NotificationKind.DueSoon, $"is due tomorrow, {due:yyyy-MM-dd} (UTC)"),
                DueStatus.Today => (NotificationKind.DueSoon, $"is due today, {due:yyyy-MM-dd} (UTC)"),
                DueStatus.Overdue => (NotificationKind.Overdue, $"was due {due:yyyy-MM-dd} (UTC), {today.DayNumber - due.DayNumber} day(s) ago"),
                _ => (null, null),
            };
            if (kind is null)
            {
                continue;
            }

            var subject = status == DueStatus.Overdue
                ? $"{i.CandidateId}: '{i.Title}' is overdue (was due {due:yyyy-MM-dd})"
                : $"{i.CandidateId}: '{i.Title}' is due {(status == DueStatus.Today ? "today" : "tomorrow")} ({due:yyyy-MM-dd})";
            notices.Add(Notification.Create(i.OwnerId!, kind, i.CaseId, i.Key, subject,
                $"The checklist item '{i.Title}' ({i.Key}) of case {i.CandidateId}, assigned to you, {phrase}; it is {StateNames.Of(i.State)}. " +
                "If it cannot be done in time, tell the case's coordinator.",
                $"/cases/{i.CaseId}/items/{Uri.EscapeDataString(i.Key)}", $"{kind}:{i.OwnerId}:{i.Id}:{due:yyyy-MM-dd}", now));
        }

        return notices;
    }
}
