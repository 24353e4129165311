namespace EventReview.Core.Cases;

/// <summary>
/// A requested change breaks a rule of the review (an invalid transition). <see cref="Rule"/> is a stable,
/// machine-readable name ("four-eyes", "distinct-signers", ...); the message explains it to a person.
/// Nothing has changed when this is thrown.
/// </summary>
public sealed class DomainRuleException(string rule, string message) : InvalidOperationException(message)
{
    /// <summary>Stable name of the rule that refused the change.</summary>
    public string Rule { get; } = rule;
}
