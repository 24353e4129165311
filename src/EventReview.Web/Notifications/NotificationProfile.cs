using System.Security.Claims;
using EventReview.Core.Notifications;
using EventReview.Data;
using EventReview.Data.Notifications;
using EventReview.Data.Writes;
using EventReview.Web.Auth;
using EventReview.Web.Services;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Notifications;

/// <summary>A signed-in person's own notification choices, test message and recent deliveries (the profile page).</summary>
public sealed class NotificationProfile(IDbContextFactory<AppDbContext> dbFactory, IWriteGate writes, TimeProvider clock, IOptions<NotificationOptions> options)
{
    /// <summary>What this server can send: e-mail (an SMTP host is set) and webhooks (allowed).</summary>
    public (bool Email, bool Webhooks) Channels => (options.Value.Smtp.Enabled, options.Value.Webhooks.Enabled);

    public int DigestHourUtc => options.Value.DigestHourUtc;

    /// <summary>The person's choices (the defaults when they never changed them).</summary>
    public async Task<NotificationSettings> GetAsync(ClaimsPrincipal user, CancellationToken ct = default)
    {
        var id = Me(user);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await db.NotificationSettings.AsNoTracking().FirstOrDefaultAsync(s => s.UserId == id, ct) ?? NotificationSettings.Defaults(id);
    }

    /// <summary>Stores the person's choices.</summary>
    /// <exception cref="ArgumentException">When the webhook address is not acceptable (message says why; nothing stored).</exception>
    public Task<NotificationSettings> SaveAsync(ClaimsPrincipal user, NotificationEvents events, bool byEmail, string? webhookUrl, bool digest, CancellationToken ct = default)
    {
        if (WebhookTarget.Problem(webhookUrl, options.Value.Webhooks) is { } problem)
        {
            throw new ArgumentException(problem, nameof(webhookUrl));
        }

        return ChangeAsync(user, s => s.Change(events, byEmail, webhookUrl, digest, clock.GetUtcNow()), ct);
    }

    /// <summary>Makes a new webhook secret; the old one stops verifying at once.</summary>
    public Task<NotificationSettings> RenewSecretAsync(ClaimsPrincipal user, CancellationToken ct = default) =>
        ChangeAsync(user, s => s.RenewSecret(clock.GetUtcNow()), ct);

    /// <summary>Queues a test message to the person's channels (sent at the worker's next pass, even with the digest).</summary>
    public async Task SendTestAsync(ClaimsPrincipal user, CancellationToken ct = default)
    {
        var id = Me(user);
        var now = clock.GetUtcNow();
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        db.Notifications.Add(Notification.Create(id, NotificationKind.Test, null, null, "Test message",
            $"You asked for a test message from your EventReview profile at {now.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC. If you read this, the channel works.",
            "/profile", $"{NotificationKind.Test}:{id}:{Guid.NewGuid():N}", now));
        await writes.SaveAsync(db, ct);
    }

    /// <summary>The person's newest outbox messages (what was sent, is being retried, or was given up).</summary>
    public async Task<IReadOnlyList<OutboxMessage>> RecentMessagesAsync(ClaimsPrincipal user, int count = 20, CancellationToken ct = default)
    {
        var id = Me(user);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await db.OutboxMessages.AsNoTracking().Where(m => m.UserId == id).OrderByDescending(m => m.Id).Take(count).ToListAsync(ct);
    }

    /// <summary>How many of the person's notifications wait for the next digest.</summary>
    public async Task<int> WaitingForDigestAsync(ClaimsPrincipal user, CancellationToken ct = default)
    {
        var id = Me(user);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return await db.Notifications.CountAsync(n => n.UserId == id && n.RoutedAt == null, ct);
    }

    private async Task<NotificationSettings> ChangeAsync(ClaimsPrincipal user, Action<NotificationSettings> change, CancellationToken ct)
    {
        var id = Me(user);
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var row = await db.NotificationSettings.FirstOrDefaultAsync(s => s.UserId == id, ct);
        if (row is null)
        {
            row = NotificationSettings.Defaults(id);
            db.NotificationSettings.Add(row);
        }

        change(row);
        await writes.SaveAsync(db, ct);
        return row;
    }

    private static string Me(ClaimsPrincipal user)
    {
        Permissions.Require(user, Policies.Person, "have a profile");
        return user.ToActor().UserId;
    }
}
