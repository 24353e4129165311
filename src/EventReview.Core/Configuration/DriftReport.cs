using EventReview.Core.Verdicts;

namespace EventReview.Core.Configuration;

/// <summary>
/// A later snapshot checked against the frozen one. <see cref="CapturedDuringFreeze"/> is true when the later snapshot
/// was captured inside the freeze period (bounds inclusive), false outside it, and null when the freeze period is not known
/// (a plain comparison of two files). The judgement is "no drift", "drift" (changes captured outside the freeze period, or
/// with no freeze period known: a note) or "concern" (changes captured during the freeze period).
/// </summary>
public sealed record DriftReport(
    string SiteCode,
    DateTimeOffset? LaterCapturedAt,
    bool? CapturedDuringFreeze,
    ConfigurationDiffResult Diff,
    Judgement Judgement)
{
    /// <summary>The stored verdict word ("no drift", "drift", "concern").</summary>
    public string Verdict => Judgement.Word;

    /// <summary>One line for people: the reason of the judgement.</summary>
    public string Summary => Judgement.Reason;

    /// <summary>True when the verdict is "concern".</summary>
    public bool IsConcern => Judgement.Verdict == Verdicts.Verdict.Concern;
}
