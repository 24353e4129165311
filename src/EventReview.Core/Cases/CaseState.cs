namespace EventReview.Core.Cases;

/// <summary>Where a case stands. Closed cases carry a <see cref="CaseOutcome"/>.</summary>
public enum CaseState
{
    /// <summary>Opened, no work recorded yet.</summary>
    Open,

    /// <summary>The team is working through the checklist.</summary>
    InReview,

    /// <summary>Every required item is signed; the decision board is to decide.</summary>
    AwaitingDecision,

    /// <summary>Decided; nothing more can change.</summary>
    Closed,
}
