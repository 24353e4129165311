namespace EventReview.Web.Services.Overview;

/// <summary>A headline number of the overview, read from a check's newest computation record.</summary>
/// <param name="Label">What it is ("False-alarm rate and significance").</param>
/// <param name="Value">The number with units and its uncertainty or bound, or why it cannot be shown.</param>
/// <param name="ItemKey">The item whose record it comes from (links there); null when no item runs the check.</param>
/// <param name="Verdict">That record's verdict word, or "not run".</param>
public sealed record Headline(string Label, string Value, string? ItemKey, string Verdict);
