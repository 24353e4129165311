using System.Security.Cryptography;

namespace EventReview.Core.Records;

/// <summary>
/// A record key's public part and validity (null end: the current key). Verifies ECDSA P-256 / SHA-256 signatures in IEEE P1363 form.
/// </summary>
/// <param name="SubjectPublicKeyInfo">DER SubjectPublicKeyInfo of the P-256 key.</param>
/// <param name="ValidFrom">When it started signing (UTC).</param>
/// <param name="ValidUntil">When it stopped signing (UTC); null while current.</param>
public sealed record RecordPublicKey(byte[] SubjectPublicKeyInfo, DateTimeOffset ValidFrom, DateTimeOffset? ValidUntil)
{
    /// <summary>Signature algorithm name written next to signatures.</summary>
    public const string Algorithm = "ECDSA-P256-SHA256";

    /// <summary>The key's fingerprint (<see cref="RecordKeyFingerprint.Of"/>).</summary>
    public string Fingerprint { get; } = RecordKeyFingerprint.Of(SubjectPublicKeyInfo);

    /// <summary>True when <paramref name="signature"/> (64 bytes, r then s) signs <paramref name="data"/>.</summary>
    public bool Verifies(byte[] data, byte[] signature)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(signature);
        using var key = ECDsa.Create();
        key.ImportSubjectPublicKeyInfo(SubjectPublicKeyInfo, out _);
        return key.VerifyData(data, signature, HashAlgorithmName.SHA256, DSASignatureFormat.IeeeP1363FixedFieldConcatenation);
    }

    /// <summary>The public key in PEM ("-----BEGIN PUBLIC KEY-----").</summary>
    public string Pem() => PemEncoding.WriteString("PUBLIC KEY", SubjectPublicKeyInfo);

    /// <summary>Reads a P-256 public key from PEM or DER SubjectPublicKeyInfo.</summary>
    /// <exception cref="CryptographicException">When it is not an EC P-256 public key.</exception>
    public static RecordPublicKey FromPem(string pem, DateTimeOffset validFrom, DateTimeOffset? validUntil = null)
    {
        using var key = ECDsa.Create();
        key.ImportFromPem(pem);
        if (key.KeySize != 256)
        {
            throw new CryptographicException($"The key is EC with {key.KeySize} bits; a record key is P-256.");
        }

        return new RecordPublicKey(key.ExportSubjectPublicKeyInfo(), validFrom, validUntil);
    }
}
