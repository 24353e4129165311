namespace EventReview.Core.Configuration;

/// <summary>One configuration item: its key and value.</summary>
public sealed record ConfigurationEntry(string Key, string Value);
