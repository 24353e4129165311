namespace EventReview.Core.Configuration;

/// <summary>An item whose value differs: <paramref name="Old"/> in the frozen snapshot, <paramref name="New"/> in the later one.</summary>
public sealed record ConfigurationChange(string Key, string Old, string New);
