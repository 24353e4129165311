namespace EventReview.Core.Cases;

/// <summary>One thing verification found wrong: the case, the timeline entry or item it concerns, and what.</summary>
public sealed record IntegrityProblem(string Case, int? Entry, string? Item, string What);
