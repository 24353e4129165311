using System.Text;

namespace EventReview.Core.Evidence;

/// <summary>
/// The fingerprint of an item's evidence: SHA-256 over a canonical text listing every note, attachment, link and
/// computation record in the order they were added (by time, then id: the one canonical order, <see cref="Lines(IEnumerable{EvidenceItem})"/>), one line each:
/// <c>kind|content-sha256|added-utc-ticks</c>, preceded by the line <c>eventreview-evidence-v1</c>.
/// Evidence lines come first (ordered by time added), then computation lines <c>computation|content-sha256|run-utc-ticks</c>
/// (ordered by run time), then, when given, <c>configuration|frozen-configuration-fingerprint</c>; every line ends in '\n'.
/// An item without evidence has the fingerprint of that header line alone.
/// </summary>
public static class EvidenceFingerprint
{
    /// <summary>Header line of the canonical serialisation (bump the version when the format changes).</summary>
    public const string Header = "eventreview-evidence-v1";

    /// <summary>Computes the fingerprint of the given evidence and computation records.</summary>
    public static string Compute(IEnumerable<EvidenceItem> evidence, IEnumerable<ComputationRecord> computations, string? frozenConfigurationFingerprint = null) =>
        Compute(
            Lines(evidence),
            Lines(computations),
            frozenConfigurationFingerprint);

    /// <summary>
    /// Computes the same fingerprint from plain values (offline verification). Evidence lines are ordered by
    /// <see cref="EvidenceLine.AddedUtcTicks"/> and computation lines by <see cref="ComputationLine.RunUtcTicks"/>;
    /// the sort is stable, so lines with equal times keep the order given (which must be the order of their ids).
    /// </summary>
    public static string Compute(IEnumerable<EvidenceLine> evidence, IEnumerable<ComputationLine> computations, string? frozenConfigurationFingerprint = null) =>
        Hashing.Sha256Hex(CanonicalText(evidence, computations, frozenConfigurationFingerprint));

    /// <summary>The canonical text that <see cref="Compute(IEnumerable{EvidenceLine}, IEnumerable{ComputationLine}, string?)"/> hashes.</summary>
    public static string CanonicalText(IEnumerable<EvidenceLine> evidence, IEnumerable<ComputationLine> computations, string? frozenConfigurationFingerprint = null)
    {
        var sb = new StringBuilder(Header).Append('\n');
        foreach (var e in evidence.OrderBy(e => e.AddedUtcTicks))
        {
            sb.Append(e.Kind).Append('|').Append(e.ContentSha256).Append('|').Append(e.AddedUtcTicks).Append('\n');
        }

        foreach (var c in computations.OrderBy(c => c.RunUtcTicks))
        {
            sb.Append("computation|").Append(c.ContentSha256).Append('|').Append(c.RunUtcTicks).Append('\n');
        }

        if (frozenConfigurationFingerprint is not null)
        {
            sb.Append("configuration|").Append(frozenConfigurationFingerprint).Append('\n');
        }

        return sb.ToString();
    }

    /// <summary>The evidence lines of <paramref name="evidence"/> in canonical order (time added, then id).</summary>
    public static IReadOnlyList<EvidenceLine> Lines(IEnumerable<EvidenceItem> evidence) =>
        evidence.OrderBy(e => e.AddedAt).ThenBy(e => e.Id)
            .Select(e => new EvidenceLine(KindName(e.Kind), e.ContentSha256, e.AddedAt.UtcTicks))
            .ToList();

    /// <summary>The computation lines of <paramref name="computations"/> in canonical order (run time, then id).</summary>
    public static IReadOnlyList<ComputationLine> Lines(IEnumerable<ComputationRecord> computations) =>
        computations.OrderBy(c => c.RunAt).ThenBy(c => c.Id)
            .Select(c => new ComputationLine(c.ContentSha256, c.RunAt.UtcTicks))
            .ToList();

    /// <summary>The lower-case kind name used in the canonical text ("note", "attachment", "link").</summary>
    public static string KindName(EvidenceKind kind) => kind.ToString().ToLowerInvariant();
}
