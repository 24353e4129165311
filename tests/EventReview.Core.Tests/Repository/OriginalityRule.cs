using System.Text.RegularExpressions;

namespace EventReview.Core.Tests.Repository;

/// <summary>
/// One thing the originality scan refuses in tracked files: a name, what it matches (written so that the rule's own text does
/// not match it, e.g. with a one-letter character class), the paths it applies to and the paths where it is allowed.
/// </summary>
/// <param name="Name">What the rule is about, shown in a failure.</param>
/// <param name="Pattern">What is refused.</param>
/// <param name="AppliesTo">Path prefixes (relative to the repository root) the rule scans.</param>
/// <param name="AllowedIn">Path prefixes where the match is allowed (legacy records, the one table that keeps a stored word).</param>
/// <param name="Example">A text the rule must catch, built at run time so that it does not sit in this file as it is.</param>
internal sealed record OriginalityRule(string Name, Regex Pattern, string[] AppliesTo, string[] AllowedIn, string Example)
{
    /// <summary>True when the rule scans the file at <paramref name="path"/>.</summary>
    public bool Scans(string path) =>
        AppliesTo.Any(p => path.StartsWith(p, StringComparison.Ordinal)) && !AllowedIn.Any(p => path.StartsWith(p, StringComparison.Ordinal));
}
