using EventReview.Core.Notifications;
using EventReview.Data;
using EventReview.Data.Notifications;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Notifications;

/// <summary>
/// Turns waiting notifications into outbox messages by each person's choices (<see cref="NotificationSettings"/>):
/// one message per channel at once, or, for people who chose the digest, one message per channel holding everything
/// that waited when the digest hour comes (<see cref="DigestSchedule"/>). Kinds a person did not choose are marked
/// "not wanted"; people with no usable channel, "no channel". Test messages always go at once.
/// </summary>
public sealed class NotificationRouter(NotificationComposer compose, IOptions<NotificationOptions> options)
{
    /// <summary>Notifications routed per pass.</summary>
    public const int Batch = 500;

    /// <summary>Routes what is waiting in <paramref name="db"/>; the caller saves. Returns the number of messages made.</summary>
    public async Task<int> RouteAsync(AppDbContext db, DateTimeOffset now, CancellationToken ct)
    {
        var fresh = await db.Notifications.Where(n => n.RoutedAt == null && n.Route == null).OrderBy(n => n.Id).Take(Batch).ToListAsync(ct);
        var held = await db.Notifications.Where(n => n.RoutedAt == null && n.Route == Notification.WaitingForDigest).OrderBy(n => n.Id).Take(Batch * 4).ToListAsync(ct);
        if (fresh.Count == 0 && held.Count == 0)
        {
            return 0;
        }

        var userIds = fresh.Concat(held).Select(n => n.UserId).Distinct().ToList();
        var settings = await db.NotificationSettings.AsNoTracking().Where(s => userIds.Contains(s.UserId)).ToDictionaryAsync(s => s.UserId, ct);
        var emails = await db.Users.AsNoTracking().Where(u => userIds.Contains(u.Id)).ToDictionaryAsync(u => u.Id, u => u.Email, ct);
        NotificationSettings ChoiceOf(string userId) => settings.GetValueOrDefault(userId) ?? NotificationSettings.Defaults(userId);
        var made = 0;
        foreach (var n in fresh)
        {
            var choice = ChoiceOf(n.UserId);
            if (!choice.Wants(n.Kind))
            {
                n.Routed("not wanted", now);
            }
            else if (choice.Digest && n.Kind != NotificationKind.Test)
            {
                n.Hold();
            }
            else
            {
                made += Queue(db, choice, emails.GetValueOrDefault(n.UserId), n.Kind, () => compose.Email(n), r => compose.Webhook(n, r), now, out var route);
                n.Routed(route, now);
            }
        }

        // Held notifications go out together at the digest hour (or at once if the person has since left the digest).
        foreach (var group in held.GroupBy(n => n.UserId))
        {
            var choice = ChoiceOf(group.Key);
            var list = group.ToList();
            if (choice.Digest && !DigestSchedule.IsDue(list.Min(n => n.CreatedAt), now, options.Value.DigestHourUtc))
            {
                continue;
            }

            made += Queue(db, choice, emails.GetValueOrDefault(group.Key), NotificationKind.Digest, () => compose.DigestEmail(list, now), r => compose.DigestWebhook(list, r, now), now, out var route);
            list.ForEach(n => n.Routed(route == "immediate" ? "digest" : route, now));
        }

        return made;
    }

    private int Queue(AppDbContext db, NotificationSettings choice, string? email, string kind, Func<(string Subject, string Body)> mail, Func<string, string> hook, DateTimeOffset now, out string route)
    {
        var made = 0;
        var recipient = email ?? choice.UserId;
        if (choice.ByEmail && options.Value.Smtp.Enabled && !string.IsNullOrWhiteSpace(email))
        {
            var (subject, body) = mail();
            db.OutboxMessages.Add(OutboxMessage.Create(choice.UserId, OutboxMessage.Email, email, kind, subject, body, now));
            made++;
        }

        if (choice.WebhookUrl is { } url && options.Value.Webhooks.Enabled)
        {
            var (subject, _) = mail();
            db.OutboxMessages.Add(OutboxMessage.Create(choice.UserId, OutboxMessage.Webhook, url, kind, subject, hook(recipient), now));
            made++;
        }

        route = made > 0 ? "immediate" : "no channel";
        return made;
    }
}
