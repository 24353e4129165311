namespace EventReview.Core.Configuration;

/// <summary>
/// Differences between a frozen snapshot and a later one: keys only in the later one (<see cref="Added"/>), keys only
/// in the frozen one (<see cref="Removed"/>), keys with a different value (<see cref="Changed"/>; values compared
/// ordinally, so case and white space count), and the number of keys with the same value. Lists are in ordinal key order.
/// </summary>
public sealed record ConfigurationDiffResult(
    IReadOnlyList<ConfigurationEntry> Added,
    IReadOnlyList<ConfigurationEntry> Removed,
    IReadOnlyList<ConfigurationChange> Changed,
    int Unchanged)
{
    /// <summary>True when anything was added, removed or changed.</summary>
    public bool HasDrift => Added.Count > 0 || Removed.Count > 0 || Changed.Count > 0;
}
