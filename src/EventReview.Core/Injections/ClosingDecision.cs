using EventReview.Core.Verdicts;

namespace EventReview.Core.Injections;

/// <summary>Whether a case may be closed with an outcome, as far as sealed blind-injection records are concerned.</summary>
/// <param name="Allowed">True when nothing in the sealed records stands in the way.</param>
/// <param name="Rule">The stable rule name when refused ("sealed-record-unopened", "blind-injection-overlap"), else null.</param>
/// <param name="Judgement">"sealed" (a record not opened), "concern" (an opened record shows a blind injection at the candidate) or "clear", with the reason.</param>
public sealed record ClosingDecision(bool Allowed, string? Rule, Judgement Judgement);
