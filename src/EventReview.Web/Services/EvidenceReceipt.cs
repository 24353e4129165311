using EventReview.Core.Checklists;

namespace EventReview.Web.Services;

/// <summary>What an append of evidence stored: the row, its content hash and the item's state and fingerprint after it.</summary>
public sealed record EvidenceReceipt(int EvidenceId, string ContentSha256, long? SizeBytes, string? FileName, ItemState ItemState, string ItemFingerprint);
