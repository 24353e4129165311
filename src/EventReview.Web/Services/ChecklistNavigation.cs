using EventReview.Core.Checklists;

namespace EventReview.Web.Services;

/// <summary>
/// Keyboard moves in the checklist, in checklist order (sections, then items): "j" the next item, "k" the previous one;
/// with nothing selected "j" starts at the first item and "k" at the last. Stays put at either end.
/// </summary>
public static class ChecklistNavigation
{
    /// <summary>The keys and what they do, for the help overlay.</summary>
    public static IReadOnlyList<(string Key, string Does)> Help { get; } =
    [
        ("j", "next item"),
        ("k", "previous item"),
        ("Enter", "open the item under the keyboard focus"),
        ("?", "show or hide this help"),
    ];

    /// <summary>The item to select after <paramref name="key"/> ("j" or "k"), or null when the key does not move.</summary>
    public static string? Move(IEnumerable<ChecklistItem> items, string? selectedKey, string key)
    {
        ArgumentNullException.ThrowIfNull(items);
        var order = items.OrderBy(i => i.SectionOrder).ThenBy(i => i.Order).Select(i => i.Key).ToList();
        if (order.Count == 0 || key is not ("j" or "k"))
        {
            return null;
        }

        var at = selectedKey is null ? -1 : order.IndexOf(selectedKey);
        if (at < 0)
        {
            return key == "j" ? order[0] : order[^1];
        }

        var next = Math.Clamp(at + (key == "j" ? 1 : -1), 0, order.Count - 1);
        return next == at ? null : order[next];
    }
}
