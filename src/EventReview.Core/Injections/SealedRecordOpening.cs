using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Inputs;

namespace EventReview.Core.Injections;

/// <summary>
/// When a sealed blind-injection record may be opened. Opening it tells the reviewers whether the candidate is a test,
/// so it comes last: every item of the sections that follow the opening item's own section, up to and including the last
/// section that holds a built-in check, must be signed off first (in the candidate review: sections 2-6, the detectors'
/// state, cross-site consistency, local causes, the data chain and the significance; the sign-off and dossier sections
/// after them are done once the record is opened). A coordinator may override with a written reason, which the case's
/// timeline keeps. Like <see cref="BlindInjectionClosing"/>, this rule flags; people decide.
/// </summary>
public static class SealedRecordOpening
{
    /// <summary>Shortest override reason accepted, characters (a reason must say why, not just "ok").</summary>
    public const int MinReasonLength = 10;

    /// <summary>The sections whose items must be signed before the record is opened from <paramref name="itemKey"/>, in checklist order.</summary>
    /// <exception cref="KeyNotFoundException">When the case has no such item.</exception>
    public static IReadOnlyList<(string Key, string Title)> RequiredSections(ReviewCase c, string itemKey)
    {
        ArgumentNullException.ThrowIfNull(c);
        var own = c.Item(itemKey).SectionOrder;
        var sections = c.Items.GroupBy(i => (i.SectionOrder, i.SectionKey, i.SectionTitle)).OrderBy(g => g.Key.SectionOrder).ToList();
        var lastWithCheck = sections.LastOrDefault(g => g.Any(i => i.CheckKind is not null))?.Key.SectionOrder ?? own;
        return [.. sections.Where(g => g.Key.SectionOrder > own && g.Key.SectionOrder <= lastWithCheck).Select(g => (g.Key.SectionKey, g.Key.SectionTitle))];
    }

    /// <summary>Decides whether the record may be opened from <paramref name="itemKey"/> now.</summary>
    /// <param name="c">The case, with its items' current states.</param>
    /// <param name="itemKey">The item the record is opened from (e.g. injection.blind-open).</param>
    /// <param name="overrideReason">A coordinator's written reason to open before the required items are signed; null or blank for none.</param>
    /// <exception cref="KeyNotFoundException">When the case has no such item.</exception>
    /// <exception cref="ArgumentException">When the override reason is longer than <see cref="InputLimits.MaxStatementLength"/>.</exception>
    public static OpeningDecision Decide(ReviewCase c, string itemKey, string? overrideReason = null)
    {
        var required = RequiredSections(c, itemKey);
        var keys = required.Select(s => s.Key).ToHashSet(StringComparer.Ordinal);
        var titles = required.Select(s => s.Title).ToList();
        var unsigned = c.Items.Where(i => keys.Contains(i.SectionKey) && i.State != ItemState.SignedOff)
            .OrderBy(i => i.SectionOrder).ThenBy(i => i.Order).Select(i => i.Key).ToList();
        var sections = titles.Count == 0 ? "no section" : string.Join("; ", titles);
        if (unsigned.Count == 0)
        {
            return new OpeningDecision(true, false, [], titles, $"every item of the required sections is signed off ({sections})");
        }

        var missing = $"{unsigned.Count} item(s) of the required sections ({sections}) are not signed off: " +
                      string.Join(", ", unsigned.Take(8)) + (unsigned.Count > 8 ? ", ..." : string.Empty);
        var reason = InputGuard.Text(overrideReason?.Trim(), InputLimits.MaxStatementLength, "overrideReason");
        if (reason.Length >= MinReasonLength)
        {
            return new OpeningDecision(true, true, unsigned, titles, $"opened before the review was complete, by a coordinator's override: {reason}. At the time {missing}.");
        }

        return new OpeningDecision(false, false, unsigned, titles,
            $"The sealed record is opened only when every item of the required sections is signed; {missing}. " +
            $"A coordinator may override with a written reason (at least {MinReasonLength} characters), which goes into the case's timeline.");
    }
}
