namespace EventReview.Core.Notifications;

/// <summary>The events a person can choose to be told about (stored as a bit set in their notification settings).</summary>
[Flags]
public enum NotificationEvents
{
    /// <summary>No events: the person is told about nothing.</summary>
    None = 0,

    /// <summary>A checklist item was assigned to you.</summary>
    Assigned = 1,

    /// <summary>An item you own is due tomorrow (or today), or is overdue.</summary>
    Due = 2,

    /// <summary>Evidence changed after you signed an item: your sign-off is stale and no longer counts.</summary>
    StaleSignOff = 4,

    /// <summary>Every item of a case you coordinate is signed: it can go to the committee for decision.</summary>
    ReadyForDecision = 8,

    /// <summary>An integrity verification found a problem (coordinators only).</summary>
    VerifyFailed = 16,

    /// <summary>Every event above.</summary>
    All = Assigned | Due | StaleSignOff | ReadyForDecision | VerifyFailed,
}
