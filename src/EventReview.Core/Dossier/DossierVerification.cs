namespace EventReview.Core.Dossier;

/// <summary>
/// The result of verifying a dossier. <see cref="Status"/> is <see cref="ValidWord"/> only when nothing is wrong and the
/// manifest carries a signature by a key the verifier trusts; <see cref="UnsignedWord"/> when nothing is wrong but there
/// is no such signature (<see cref="Signature"/> says why); <see cref="InvalidWord"/> when something does not match.
/// </summary>
/// <param name="Valid">True only for status "valid".</param>
/// <param name="Problems">Everything that does not match (empty unless invalid).</param>
/// <param name="Status">"valid", "unsigned" or "invalid".</param>
/// <param name="Signature">What the signature check found, in words.</param>
/// <param name="SignedBy">Fingerprint of the trusted key that signed the manifest, or null.</param>
public sealed record DossierVerification(bool Valid, IReadOnlyList<DossierProblem> Problems, string Status = DossierVerification.InvalidWord,
    string Signature = "not checked", string? SignedBy = null)
{
    public const string ValidWord = "valid", UnsignedWord = "unsigned", InvalidWord = "invalid";

    /// <summary>A result holding <paramref name="problems"/>: invalid when there are any, else unsigned (no signature was checked).</summary>
    public static DossierVerification Of(IReadOnlyList<DossierProblem> problems) => Of(problems, null, "not checked");

    /// <summary>Invalid with problems; else valid when <paramref name="signedBy"/> names a trusted key, unsigned when it is null.</summary>
    public static DossierVerification Of(IReadOnlyList<DossierProblem> problems, string? signedBy, string signature) =>
        problems.Count > 0 ? new(false, problems, InvalidWord, signature, signedBy)
        : signedBy is null ? new(false, problems, UnsignedWord, signature)
        : new(true, problems, ValidWord, signature, signedBy);
}
