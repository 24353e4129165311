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

    /// <summary>The item state whose plain word is <paramref name="word"/> (the reverse of <see cref="Of(ItemState)"/>).</summary>
    public static bool TryParse(string? word, out ItemState state)
    {
        state = Enum.GetValues<ItemState>().FirstOrDefault(s => Of(s) == word);
        return word is not null && Of(state) == word;
    }

    /// <summary>The case state whose plain word is <paramref name="word"/>.</summary>
    public static bool TryParse(string? word, out CaseState state)
    {
        state = Enum.GetValues<CaseState>().FirstOrDefault(s => Of(s) == word);
        return word is not null && Of(state) == word;
    }

    /// <summary>The outcome whose plain word is <paramref name="word"/>.</summary>
    public static bool TryParse(string? word, out CaseOutcome outcome)
    {
        outcome = Enum.GetValues<CaseOutcome>().FirstOrDefault(o => Of(o) == word);
        return word is not null && Of(outcome) == word;
    }
}
