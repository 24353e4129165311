namespace EventReview.Core.Cases;

/// <summary>The committee's conclusion when a case is closed.</summary>
public enum CaseOutcome
{
    /// <summary>The candidate is judged to be a signal of astrophysical origin.</summary>
    Astrophysical,
    /// <summary>The candidate is judged to come from the instruments or their environment (a glitch or other artefact).</summary>
    Instrumental,
    /// <summary>The candidate is an injection: a signal put into the detectors on purpose.</summary>
    Injection,
    /// <summary>The review could not decide what the candidate is.</summary>
    Inconclusive,
}
