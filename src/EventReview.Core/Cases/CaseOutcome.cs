namespace EventReview.Core.Cases;

/// <summary>The decision board's conclusion when a case is closed.</summary>
public enum CaseOutcome
{
    Astrophysical,
    Instrumental,
    Injection,
    Inconclusive,
}
