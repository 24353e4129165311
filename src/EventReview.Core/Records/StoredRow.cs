namespace EventReview.Core.Records;

/// <summary>One stored row: part ("evidence", "computation", "signoff"), item key, seal, detail hash, stale mark and words naming it.</summary>
public sealed record StoredRow(string Part, string? Item, string Seal, string Detail, bool Stale, long? StaleSinceUtcTicks, string Label);
