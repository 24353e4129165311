namespace EventReview.Core.Injections;

/// <summary>What the closing rule needs to know of one registered sealed record.</summary>
/// <param name="Label">The seal's label.</param>
/// <param name="Opened">True once opened (record and salt verified against the commitment).</param>
/// <param name="ComparisonWithCase">For an opened seal, its blind injections looked up against the case being closed; null when unopened.</param>
public sealed record SealState(string Label, bool Opened, InjectionOverlapReport? ComparisonWithCase);
