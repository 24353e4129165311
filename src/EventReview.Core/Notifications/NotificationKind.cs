namespace EventReview.Core.Notifications;

/// <summary>
/// The kinds of notification (<c>event</c> in a webhook body, first word of an e-mail subject line). Stored, and read
/// by receivers' scripts: never change an existing value; add a new one.
/// </summary>
public static class NotificationKind
{
    public const string Assigned = "item.assigned";
    public const string DueSoon = "item.due";
    public const string Overdue = "item.overdue";
    public const string StaleSignOff = "signoff.stale";
    public const string ReadyForDecision = "case.ready";
    public const string VerifyFailed = "verify.failed";

    /// <summary>A test message a person sent themselves from their profile (always delivered).</summary>
    public const string Test = "test";

    /// <summary>One message holding a day's notifications (webhook <c>event</c> only; never a stored notification).</summary>
    public const string Digest = "digest";

    /// <summary>The event a person chooses in their profile that covers <paramref name="kind"/>; None for <see cref="Test"/>.</summary>
    public static NotificationEvents EventOf(string kind) => kind switch
    {
        Assigned => NotificationEvents.Assigned,
        DueSoon or Overdue => NotificationEvents.Due,
        StaleSignOff => NotificationEvents.StaleSignOff,
        ReadyForDecision => NotificationEvents.ReadyForDecision,
        VerifyFailed => NotificationEvents.VerifyFailed,
        _ => NotificationEvents.None,
    };

    /// <summary>A short English label for pages and e-mail digests.</summary>
    public static string Label(string kind) => kind switch
    {
        Assigned => "assigned to you",
        DueSoon => "due soon",
        Overdue => "overdue",
        StaleSignOff => "your sign-off is stale",
        ReadyForDecision => "ready for decision",
        VerifyFailed => "verification failed",
        Test => "test message",
        _ => kind,
    };
}
