namespace EventReview.Web.Notifications;

/// <summary>
/// Settings under <c>EventReview:Notifications</c>: where links in messages point, how often the worker runs, the digest
/// hour, how long delivery is retried, and the SMTP server and webhook rules (see docs/operations.md "Notifications").
/// </summary>
public sealed class NotificationOptions
{
    public const string Section = "EventReview:Notifications";

    /// <summary>The server's public address (e.g. https://review.example.org), put before the links in messages. Empty: links are paths.</summary>
    public string? BaseUrl { get; set; }

    /// <summary>Seconds between the worker's passes (default 15). 0 stops the background worker (tests drive it themselves).</summary>
    public int PollSeconds { get; set; } = 15;

    /// <summary>Hour of the day (UTC, 0-23) at which daily digests go out (default 7).</summary>
    public int DigestHourUtc { get; set; } = 7;

    /// <summary>Hours a message is retried before it is marked as given up (default 72).</summary>
    public double GiveUpAfterHours { get; set; } = 72;

    public SmtpOptions Smtp { get; set; } = new();

    public WebhookOptions Webhooks { get; set; } = new();

    /// <summary>Sentences naming each wrong setting; empty when all is well.</summary>
    public IReadOnlyList<string> Problems()
    {
        var problems = new List<string>();
        if (!string.IsNullOrWhiteSpace(BaseUrl) && (!Uri.TryCreate(BaseUrl, UriKind.Absolute, out var u) || u.Scheme is not ("https" or "http")))
        {
            problems.Add($"{Section}:BaseUrl '{BaseUrl}' is not an absolute http(s) address, e.g. https://review.example.org.");
        }

        if (PollSeconds < 0)
        {
            problems.Add($"{Section}:PollSeconds {PollSeconds} is negative (0 stops the worker).");
        }

        if (DigestHourUtc is < 0 or > 23)
        {
            problems.Add($"{Section}:DigestHourUtc {DigestHourUtc} is not an hour of the day (0 to 23, UTC).");
        }

        if (GiveUpAfterHours is <= 0 or > 24 * 30)
        {
            problems.Add($"{Section}:GiveUpAfterHours {GiveUpAfterHours} is outside 0 to 720 hours.");
        }

        problems.AddRange(Smtp.Problems($"{Section}:Smtp"));
        if (Webhooks.TimeoutSeconds is < 1 or > 120)
        {
            problems.Add($"{Section}:Webhooks:TimeoutSeconds {Webhooks.TimeoutSeconds} is outside 1 to 120.");
        }

        return problems;
    }
}
