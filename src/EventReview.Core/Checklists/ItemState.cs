namespace EventReview.Core.Checklists;

/// <summary>Where a checklist item stands.</summary>
public enum ItemState
{
    /// <summary>Nobody has started on it.</summary>
    Open,

    /// <summary>Work and evidence are being gathered.</summary>
    InProgress,

    /// <summary>The owner says the evidence is complete; waiting for signatures.</summary>
    ReadyForSignOff,

    /// <summary>Enough distinct, current signatures.</summary>
    SignedOff,
}
