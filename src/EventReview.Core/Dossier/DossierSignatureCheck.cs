using System.Security.Cryptography;
using EventReview.Core.Records;

namespace EventReview.Core.Dossier;

/// <summary>
/// The signature part of <see cref="DossierVerifier"/>: the manifest must carry a signature
/// (<see cref="DossierSignature"/>) by one of the trusted keys. The key the manifest carries only names the signer; a
/// signature by any other key, or none, leaves the dossier unsigned. A signature by a trusted key that does not verify
/// means the manifest changed after signing: that is a problem.
/// </summary>
internal static class DossierSignatureCheck
{
    /// <summary>The fingerprint of the trusted key that signed (or null) and what was found, in words.</summary>
    public static (string? SignedBy, string Words) Check(DossierManifest? manifest, IReadOnlyList<RecordPublicKey> trusted, List<DossierProblem> problems)
    {
        if (manifest is null)
        {
            return (null, "no manifest to check a signature on");
        }

        if (manifest.Signature is not { } s)
        {
            return (null, manifest.SchemaVersion == DossierDocument.LegacySchemaVersion
                ? "schema 1 dossiers carry no signature"
                : "the manifest carries no signature");
        }

        if (s.Algorithm != RecordPublicKey.Algorithm)
        {
            return (null, $"the signature uses '{s.Algorithm}', not {RecordPublicKey.Algorithm}");
        }

        byte[] value, carried;
        try
        {
            value = Convert.FromBase64String(s.Value ?? string.Empty);
            carried = Convert.FromBase64String(s.PublicKey ?? string.Empty);
        }
        catch (FormatException)
        {
            return (null, "the signature or its public key is not base64");
        }

        var carriedFingerprint = RecordKeyFingerprint.Of(carried);
        if (!string.Equals(carriedFingerprint, s.KeyFingerprint, StringComparison.Ordinal))
        {
            return (null, $"the signature names key {Short(s.KeyFingerprint)} but carries key {Short(carriedFingerprint)}");
        }

        var key = trusted.FirstOrDefault(k => k.Fingerprint == s.KeyFingerprint);
        if (key is null)
        {
            var intact = VerifiesWith(carried, manifest.SignedText(), value) ? "intact under the key it carries" : "not even intact under the key it carries";
            return (null, trusted.Count == 0
                ? $"signed by key {Short(s.KeyFingerprint)}, but no trusted key was given to check it against (the signature is {intact})"
                : $"signed by key {Short(s.KeyFingerprint)}, which is not one of the {trusted.Count} trusted key(s) (the signature is {intact})");
        }

        if (!key.Verifies(manifest.SignedText(), value))
        {
            problems.Add(new DossierProblem(DossierManifest.FileName, "signature",
                $"does not verify with the trusted key {Short(key.Fingerprint)}: the manifest was changed after it was signed."));
            return (null, $"the signature by trusted key {Short(key.Fingerprint)} does not verify");
        }

        return (key.Fingerprint, $"signed by the trusted key {RecordKeyFingerprint.Short(key.Fingerprint)}");
    }

    private static bool VerifiesWith(byte[] spki, byte[] data, byte[] signature)
    {
        try
        {
            return new RecordPublicKey(spki, DateTimeOffset.MinValue, null).Verifies(data, signature);
        }
        catch (CryptographicException)
        {
            return false;
        }
    }

    private static string Short(string? fingerprint) => fingerprint is null ? "(none)" : RecordKeyFingerprint.Short(fingerprint);
}
