using EventReview.Core.Checklists;

namespace EventReview.Web.Services;

/// <summary>
/// The checklist's "show" filter (kept in the address as <c>?show=</c>): every item, the items not yet signed off, those ready
/// for sign-off, or those with stale sign-offs. An unknown word shows every item.
/// </summary>
public static class ChecklistFilter
{
    /// <summary>The word for "every item" (no filter).</summary>
    public const string All = "all";

    /// <summary>The filters in the order shown: address word and label.</summary>
    public static IReadOnlyList<(string Word, string Label)> Options { get; } =
    [
        (All, "all items"),
        ("to-do", "not signed off"),
        ("ready", "ready for sign-off"),
        ("stale", "stale sign-offs"),
    ];

    /// <summary>The known word for <paramref name="word"/>, or <see cref="All"/>.</summary>
    public static string Normalise(string? word) => Options.Any(o => o.Word == word) ? word! : All;

    /// <summary>The label of a filter word.</summary>
    public static string Label(string? word) => Options.First(o => o.Word == Normalise(word)).Label;

    /// <summary>The items the filter keeps, in their given order.</summary>
    public static IReadOnlyList<ChecklistItem> Apply(IEnumerable<ChecklistItem> items, string? word)
    {
        ArgumentNullException.ThrowIfNull(items);
        return Normalise(word) switch
        {
            "to-do" => items.Where(i => i.State != ItemState.SignedOff).ToList(),
            "ready" => items.Where(i => i.State == ItemState.ReadyForSignOff).ToList(),
            "stale" => items.Where(i => i.HasStaleSignOffs).ToList(),
            _ => items.ToList(),
        };
    }
}
