using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Notifications;

/// <summary>
/// Adds notifications to a context, each fact once: those whose <see cref="Notification.DedupKey"/> is already stored
/// (or repeated in the list) are left out. The caller saves (through the write gate); a race with another instance ends
/// in the unique index refusing the save, and the next pass finds the key stored.
/// </summary>
public static class NotificationInbox
{
    /// <summary>Adds the new ones of <paramref name="notifications"/> to <paramref name="db"/>; returns how many.</summary>
    public static async Task<int> AddNewAsync(AppDbContext db, IEnumerable<Notification> notifications, CancellationToken ct = default)
    {
        var list = notifications.GroupBy(n => n.DedupKey, StringComparer.Ordinal).Select(g => g.First()).ToList();
        if (list.Count == 0)
        {
            return 0;
        }

        var keys = list.Select(n => n.DedupKey).ToList();
        var known = (await db.Notifications.AsNoTracking().Where(n => keys.Contains(n.DedupKey)).Select(n => n.DedupKey).ToListAsync(ct))
            .ToHashSet(StringComparer.Ordinal);
        var added = 0;
        foreach (var n in list.Where(n => !known.Contains(n.DedupKey)))
        {
            db.Notifications.Add(n);
            added++;
        }

        return added;
    }

    /// <summary>The ids of the accounts with the coordinator role.</summary>
    public static Task<List<string>> CoordinatorIdsAsync(AppDbContext db, CancellationToken ct = default) =>
        (from ur in db.UserRoles
         join r in db.Roles on ur.RoleId equals r.Id
         where r.Name == Auth.Roles.Coordinator
         select ur.UserId).Distinct().ToListAsync(ct);
}
