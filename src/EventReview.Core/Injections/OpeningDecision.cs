namespace EventReview.Core.Injections;

/// <summary>Whether a sealed blind-injection record may be opened now, from one item of a case.</summary>
/// <param name="Allowed">True when the record may be opened (every required item signed, or a coordinator's written override).</param>
/// <param name="Overridden">True when it is allowed only because of the override; the reason then goes into the case's timeline.</param>
/// <param name="Unsigned">Keys of the items that are not signed off yet, in checklist order (empty when none).</param>
/// <param name="SectionTitles">Titles of the sections whose items must be signed before opening, in checklist order.</param>
/// <param name="Reason">Plain words: what was required, what is missing and, for an override, who may give it.</param>
public sealed record OpeningDecision(bool Allowed, bool Overridden, IReadOnlyList<string> Unsigned, IReadOnlyList<string> SectionTitles, string Reason)
{
    /// <summary>Stable name of the rule when opening is refused.</summary>
    public const string Rule = "sections-unsigned";
}
