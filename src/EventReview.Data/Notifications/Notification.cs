namespace EventReview.Data.Notifications;

/// <summary>
/// Something one person is to be told (an item assigned to them, due, a stale sign-off, ...). Made once per fact
/// (<see cref="DedupKey"/> is unique), then routed by the notification worker: into one message per channel at once,
/// or into the person's next daily digest, or skipped when the person does not want this kind.
/// </summary>
public sealed class Notification
{
    private Notification()
    {
        UserId = string.Empty;
        Kind = string.Empty;
        Subject = string.Empty;
        Text = string.Empty;
        Link = string.Empty;
        DedupKey = string.Empty;
    }

    public long Id { get; private set; }

    /// <summary>Who is told.</summary>
    public string UserId { get; private set; }

    /// <summary>One of <see cref="Core.Notifications.NotificationKind"/>.</summary>
    public string Kind { get; private set; }

    public int? CaseId { get; private set; }

    public string? ItemKey { get; private set; }

    /// <summary>One line (an e-mail subject).</summary>
    public string Subject { get; private set; }

    /// <summary>A few sentences saying what happened and what to do.</summary>
    public string Text { get; private set; }

    /// <summary>Path in the app (e.g. <c>/cases/4/items/timing</c>); made absolute with the configured base address.</summary>
    public string Link { get; private set; }

    public DateTimeOffset CreatedAt { get; private set; }

    /// <summary>Identifies the fact, so that it is told once (e.g. <c>item.due:412:2027-03-02</c>).</summary>
    public string DedupKey { get; private set; }

    /// <summary>When the worker routed it (messages made, put into a digest, or skipped); null while waiting.</summary>
    public DateTimeOffset? RoutedAt { get; private set; }

    /// <summary>How it was routed: "immediate", "digest", "not wanted", "no channel"; <see cref="WaitingForDigest"/> while held.</summary>
    public string? Route { get; private set; }

    /// <summary>The <see cref="Route"/> of a notification held for its person's next daily digest.</summary>
    public const string WaitingForDigest = "waiting for digest";

    public static Notification Create(string userId, string kind, int? caseId, string? itemKey, string subject, string text, string link, string dedupKey, DateTimeOffset now) => new()
    {
        UserId = userId,
        Kind = kind,
        CaseId = caseId,
        ItemKey = itemKey,
        Subject = Cut(subject, 200),
        Text = Cut(text, 2000),
        Link = Cut(link, 300),
        DedupKey = Cut(dedupKey, 200),
        CreatedAt = now,
    };

    /// <summary>Holds it for the next daily digest (still not routed).</summary>
    public void Hold() => Route = WaitingForDigest;

    /// <summary>Marks it routed.</summary>
    public void Routed(string route, DateTimeOffset now)
    {
        RoutedAt = now;
        Route = route;
    }

    private static string Cut(string text, int max) => text.Length <= max ? text : text[..(max - 1)] + "…";
}
