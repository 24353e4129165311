namespace EventReview.Core.Dossier;

/// <summary>
/// The server's signature over a manifest (<see cref="DossierManifest.SignedText"/>): the fingerprint of the record key
/// (<see cref="Records.RecordKeyFingerprint"/>), the algorithm (<see cref="Records.RecordPublicKey.Algorithm"/>), the
/// public key (base64 DER SubjectPublicKeyInfo) and the signature (base64, IEEE P1363: r then s). The public key given
/// here only says which key signed: a dossier verifies as signed only with a key the verifier trusts.
/// </summary>
public sealed record DossierSignature(string KeyFingerprint, string Algorithm, string PublicKey, string Value);
