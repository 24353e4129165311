namespace EventReview.Core.Dossier;

/// <summary>
/// A computation record. <paramref name="ResultJson"/> and <paramref name="ParametersJson"/> are the stored JSON
/// texts, kept as strings so their hash is recomputable byte for byte; <paramref name="ContentSha256"/> is
/// <see cref="Evidence.ComputationRecord.ComputeContentSha256"/> of them. <paramref name="Pictures"/> names the SVG
/// files in the ZIP (<c>pictures/&lt;n&gt;.svg</c>); <paramref name="PicturesSha256"/> (schema 2) is the SHA-256 of the
/// pictures as stored (one text, separated by <c>&lt;!--next--&gt;</c>), which the record's seal covers.
/// </summary>
public sealed record DossierComputation(
    long Id,
    string Kind,
    string ParametersJson,
    string InputFingerprint,
    string ToolVersion,
    string ResultJson,
    string Verdict,
    string Summary,
    string ContentSha256,
    string RunBy,
    string RunByName,
    string RunAtUtc,
    long RunAtUtcTicks,
    IReadOnlyList<string> Pictures,
    string? PicturesSha256 = null);
