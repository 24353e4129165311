namespace EventReview.Core.Notifications;

/// <summary>
/// The kinds of notification (<c>event</c> in a webhook body, first word of an e-mail subject line). Stored, and read
/// by receivers' scripts: never change an existing value; add a new one.
/// </summary>
public static class NotificationKind
{
    /// <summary>A checklist item was assigned to the recipient.</summary>
    public const string Assigned = "item.assigned";
    /// <summary>An item the recipient owns is due today or tomorrow (UTC dates).</summary>
    public const string DueSoon = "item.due";
    /// <summary>An item the recipient owns is past its due date (UTC dates).</summary>
    public const string Overdue = "item.overdue";
    /// <summary>Evidence changed after the recipient signed an item: the sign-off is stale and no longer counts.</summary>
    public const string StaleSignOff = "signoff.stale";
    /// <summary>Every item of a case is signed off: the case can go to the committee for decision.</summary>
    public const string ReadyForDecision = "case.ready";
    /// <summary>An integrity verification found a problem (sent to coordinators).</summary>
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
