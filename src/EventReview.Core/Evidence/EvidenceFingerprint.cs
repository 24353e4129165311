using System.Text;

namespace EventReview.Core.Evidence;

/// <summary>
/// The fingerprint of an item's evidence: SHA-256 over a canonical text listing every note, attachment, link and
/// computation record in the order they were added (by id, then time), one line each:
/// <c>kind|content-sha256|added-utc-ticks</c>, preceded by the line <c>eventreview-evidence-v1</c>.
/// An item without evidence has the fingerprint of that header line alone.
/// </summary>
public static class EvidenceFingerprint
{
    /// <summary>Header line of the canonical serialisation (bump the version when the format changes).</summary>
    public const string Header = "eventreview-evidence-v1";

    /// <summary>Computes the fingerprint of the given evidence and computation records.</summary>
    public static string Compute(IEnumerable<EvidenceItem> evidence, IEnumerable<ComputationRecord> computations, string? frozenConfigurationFingerprint = null)
    {
        var sb = new StringBuilder(Header).Append('\n');
        foreach (var e in evidence.OrderBy(e => e.AddedAt).ThenBy(e => e.Id))
        {
            sb.Append(e.Kind.ToString().ToLowerInvariant()).Append('|').Append(e.ContentSha256).Append('|')
              .Append(e.AddedAt.UtcTicks).Append('\n');
        }

        foreach (var c in computations.OrderBy(c => c.RunAt).ThenBy(c => c.Id))
        {
            sb.Append("computation|").Append(c.ContentSha256).Append('|').Append(c.RunAt.UtcTicks).Append('\n');
        }

        if (frozenConfigurationFingerprint is not null)
        {
            sb.Append("configuration|").Append(frozenConfigurationFingerprint).Append('\n');
        }

        return Hashing.Sha256Hex(sb.ToString());
    }
}
