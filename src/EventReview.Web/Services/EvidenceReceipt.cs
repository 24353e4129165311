using EventReview.Core.Checklists;
using EventReview.Core.Evidence.Roles;

namespace EventReview.Web.Services;

/// <summary>
/// What an append of evidence stored: the row, its content hash and the item's state and fingerprint after it; for a file,
/// its role and, when the role was guessed rather than given, what it was guessed from.
/// </summary>
public sealed record EvidenceReceipt(int EvidenceId, string ContentSha256, long? SizeBytes, string? FileName, ItemState ItemState, string ItemFingerprint)
{
    /// <summary>The file's role (null for notes and links).</summary>
    public FileRole? Role { get; init; }

    /// <summary>What the role was guessed from, or null when it was given.</summary>
    public string? RoleGuess { get; init; }
}
