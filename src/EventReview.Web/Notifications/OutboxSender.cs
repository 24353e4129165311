using EventReview.Core.Notifications;
using EventReview.Data;
using EventReview.Data.Notifications;
using EventReview.Data.Writes;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Notifications;

/// <summary>
/// Sends the outbox messages that are due: claims each for a short time (so two app instances never send it together),
/// sends it, and records the result; a failure is logged and retried later (<see cref="RetrySchedule"/>) until the
/// give-up time, after which the message stays, marked given up, for the person's profile page and the log.
/// </summary>
public sealed class OutboxSender(IDbContextFactory<AppDbContext> dbFactory, IWriteGate writes, SmtpMailer mailer, WebhookSender webhooks,
    IOptions<NotificationOptions> options, ILogger<OutboxSender> log)
{
    /// <summary>Messages looked at per pass.</summary>
    public const int Batch = 50;

    /// <summary>How long a claim lasts (a crashed instance's claim runs out after this).</summary>
    public static readonly TimeSpan ClaimFor = TimeSpan.FromMinutes(5);

    /// <summary>Sends what is due at <paramref name="now"/>; returns (sent, failed).</summary>
    public async Task<(int Sent, int Failed)> SendDueAsync(DateTimeOffset now, CancellationToken ct)
    {
        List<long> due;
        await using (var db = await dbFactory.CreateDbContextAsync(ct))
        {
            due = await db.OutboxMessages.AsNoTracking()
                .Where(m => m.SentAt == null && m.GaveUpAt == null && m.NextAttemptAt <= now && (m.ClaimedUntil == null || m.ClaimedUntil < now))
                .OrderBy(m => m.NextAttemptAt).ThenBy(m => m.Id).Select(m => m.Id).Take(Batch).ToListAsync(ct);
        }

        var claimed = new List<OutboxMessage>();
        foreach (var id in due)
        {
            var until = now + ClaimFor;
            var won = await writes.RunAsync((db, token) => db.OutboxMessages
                .Where(m => m.Id == id && m.SentAt == null && m.GaveUpAt == null && (m.ClaimedUntil == null || m.ClaimedUntil < now))
                .ExecuteUpdateAsync(s => s.SetProperty(m => m.ClaimedUntil, until), token), ct);
            if (won == 1)
            {
                await using var db = await dbFactory.CreateDbContextAsync(ct);
                claimed.Add(await db.OutboxMessages.AsNoTracking().FirstAsync(m => m.Id == id, ct));
            }
        }

        if (claimed.Count == 0)
        {
            return (0, 0);
        }

        var results = new Dictionary<long, string?>();
        var mails = claimed.Where(m => m.Channel == OutboxMessage.Email).ToList();
        if (mails.Count > 0)
        {
            var sent = options.Value.Smtp.Enabled ? await mailer.SendAsync(mails, ct) : mails.Select(_ => (string?)"E-mail is not set up on this server (no SMTP host).").ToList();
            for (var i = 0; i < mails.Count; i++)
            {
                results[mails[i].Id] = sent[i];
            }
        }

        foreach (var hook in claimed.Where(m => m.Channel == OutboxMessage.Webhook))
        {
            results[hook.Id] = await webhooks.SendAsync(hook, ct);
        }

        return await RecordAsync(claimed, results, now, ct);
    }

    private async Task<(int Sent, int Failed)> RecordAsync(List<OutboxMessage> claimed, Dictionary<long, string?> results, DateTimeOffset now, CancellationToken ct)
    {
        var giveUp = TimeSpan.FromHours(options.Value.GiveUpAfterHours);
        var ids = claimed.Select(m => m.Id).ToList();
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var rows = await db.OutboxMessages.Where(m => ids.Contains(m.Id)).ToListAsync(ct);
        var (sent, failed) = (0, 0);
        foreach (var m in rows)
        {
            if (results[m.Id] is not { } error)
            {
                m.Sent(now);
                sent++;
                continue;
            }

            var next = RetrySchedule.NextAttempt(m.CreatedAt, now, m.Attempts + 1, giveUp);
            m.Failed(error, now, next);
            failed++;
            if (next is { } at)
            {
                log.LogWarning("Notification {MessageId} ({Channel}) attempt {Attempt} failed, retrying at {NextAttempt:u}: {Error}", m.Id, m.Channel, m.Attempts, at, error);
            }
            else
            {
                log.LogError("Notification {MessageId} ({Channel}) given up after {Attempts} attempts over {Hours} h: {Error}", m.Id, m.Channel, m.Attempts, giveUp.TotalHours, error);
            }
        }

        await writes.SaveAsync(db, ct);
        return (sent, failed);
    }
}
