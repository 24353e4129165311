namespace EventReview.Core.Configuration;

/// <summary>Compares a later configuration snapshot with the frozen one, key by key.</summary>
public static class ConfigurationDiff
{
    /// <summary>
    /// Added, removed and changed keys of <paramref name="later"/> relative to <paramref name="frozen"/>
    /// (exact ordinal comparison of keys and values), in ordinal key order.
    /// </summary>
    public static ConfigurationDiffResult Compare(IReadOnlyDictionary<string, string> frozen, IReadOnlyDictionary<string, string> later)
    {
        ArgumentNullException.ThrowIfNull(frozen);
        ArgumentNullException.ThrowIfNull(later);
        var added = new List<ConfigurationEntry>();
        var removed = new List<ConfigurationEntry>();
        var changed = new List<ConfigurationChange>();
        var unchanged = 0;
        foreach (var key in frozen.Keys.Order(StringComparer.Ordinal))
        {
            if (!later.TryGetValue(key, out var now))
            {
                removed.Add(new ConfigurationEntry(key, frozen[key]));
            }
            else if (string.Equals(frozen[key], now, StringComparison.Ordinal))
            {
                unchanged++;
            }
            else
            {
                changed.Add(new ConfigurationChange(key, frozen[key], now));
            }
        }

        foreach (var key in later.Keys.Where(k => !frozen.ContainsKey(k)).Order(StringComparer.Ordinal))
        {
            added.Add(new ConfigurationEntry(key, later[key]));
        }

        return new ConfigurationDiffResult(added, removed, changed, unchanged);
    }
}
