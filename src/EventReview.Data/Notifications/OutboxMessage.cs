namespace EventReview.Data.Notifications;

/// <summary>
/// One e-mail or webhook request waiting to be sent, being retried, sent, or given up (the outbox). Written before any
/// attempt, so a message survives a restart or an unreachable server; the worker claims it for a short time
/// (<see cref="ClaimedUntil"/>) so that two app instances never send it twice at once.
/// </summary>
public sealed class OutboxMessage
{
    public const string Email = "email";
    public const string Webhook = "webhook";

    private OutboxMessage()
    {
        UserId = string.Empty;
        Channel = string.Empty;
        Target = string.Empty;
        Kind = string.Empty;
        Subject = string.Empty;
        Body = string.Empty;
    }

    public long Id { get; private set; }

    public string UserId { get; private set; }

    /// <summary><see cref="Email"/> or <see cref="Webhook"/>.</summary>
    public string Channel { get; private set; }

    /// <summary>The e-mail address or the webhook URL.</summary>
    public string Target { get; private set; }

    /// <summary>The notification kind, or "digest".</summary>
    public string Kind { get; private set; }

    public string Subject { get; private set; }

    /// <summary>Plain text (e-mail) or the JSON body (webhook).</summary>
    public string Body { get; private set; }

    public DateTimeOffset CreatedAt { get; private set; }

    public int Attempts { get; private set; }

    public DateTimeOffset NextAttemptAt { get; private set; }

    public DateTimeOffset? ClaimedUntil { get; private set; }

    public DateTimeOffset? SentAt { get; private set; }

    /// <summary>Set when retries stopped (see <see cref="Core.Notifications.RetrySchedule"/>); the message stays for the record.</summary>
    public DateTimeOffset? GaveUpAt { get; private set; }

    /// <summary>What went wrong at the last attempt (never a password or secret).</summary>
    public string? LastError { get; private set; }

    /// <summary>Waiting, retrying, sent or given up.</summary>
    public string Status => SentAt is not null ? "sent" : GaveUpAt is not null ? "given up" : Attempts > 0 ? "retrying" : "waiting";

    public static OutboxMessage Create(string userId, string channel, string target, string kind, string subject, string body, DateTimeOffset now) => new()
    {
        UserId = userId,
        Channel = channel,
        Target = target,
        Kind = kind,
        Subject = subject.Length <= 200 ? subject : subject[..200],
        Body = body,
        CreatedAt = now,
        NextAttemptAt = now,
    };

    public void Sent(DateTimeOffset now)
    {
        Attempts++;
        SentAt = now;
        ClaimedUntil = null;
        LastError = null;
    }

    /// <summary>Records a failed attempt; <paramref name="next"/> null gives up.</summary>
    public void Failed(string error, DateTimeOffset now, DateTimeOffset? next)
    {
        Attempts++;
        LastError = error.Length <= 500 ? error : error[..500];
        ClaimedUntil = null;
        if (next is { } n)
        {
            NextAttemptAt = n;
        }
        else
        {
            GaveUpAt = now;
        }
    }
}
