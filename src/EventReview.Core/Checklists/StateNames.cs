using EventReview.Core.Cases;

namespace EventReview.Core.Checklists;

/// <summary>Plain words for states, used in messages, the UI and the API.</summary>
public static class StateNames
{
    public static string Of(ItemState state) => state switch
    {
        ItemState.Open => "open",
        ItemState.InProgress => "in progress",
        ItemState.ReadyForSignOff => "ready for sign-off",
        ItemState.SignedOff => "signed off",
        _ => state.ToString(),
    };

    public static string Of(CaseState state) => state switch
    {
        CaseState.Open => "open",
        CaseState.InReview => "in review",
        CaseState.AwaitingDecision => "awaiting decision",
        CaseState.Closed => "closed",
        _ => state.ToString(),
    };

    public static string Of(CaseOutcome outcome) => outcome.ToString().ToLowerInvariant();
}
