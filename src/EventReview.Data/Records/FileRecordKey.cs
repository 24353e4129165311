using System.Security.Cryptography;
using System.Text;
using EventReview.Core.Records;

namespace EventReview.Data.Records;

/// <summary>
/// One record key held in a file: an ECDSA P-256 private key, and the entry MAC key derived from its private scalar with
/// HKDF-SHA-256 (RFC 5869; empty salt, info <c>eventreview-entry-mac-v1</c>, 32 bytes).
/// </summary>
public sealed class FileRecordKey : IRecordSigner, IDisposable
{
    private readonly ECDsa _key;
    private readonly byte[] _macKey;
    private readonly Lock _gate = new();

    private FileRecordKey(ECDsa key)
    {
        _key = key;
        PublicKey = key.ExportSubjectPublicKeyInfo();
        KeyId = RecordKeyFingerprint.Of(PublicKey);
        var d = key.ExportParameters(includePrivateParameters: true).D ?? throw new CryptographicException("The record key has no private part.");
        _macKey = HKDF.DeriveKey(HashAlgorithmName.SHA256, d, 32, [], Encoding.ASCII.GetBytes("eventreview-entry-mac-v1"));
        CryptographicOperations.ZeroMemory(d);
    }

    public string KeyId { get; }

    public byte[] PublicKey { get; }

    /// <summary>A new random P-256 key.</summary>
    public static FileRecordKey Generate() => new(ECDsa.Create(ECCurve.NamedCurves.nistP256));

    /// <summary>Reads a PKCS#8 PEM private key.</summary>
    /// <exception cref="CryptographicException">When it is not a P-256 private key.</exception>
    public static FileRecordKey FromPem(string pem)
    {
        var key = ECDsa.Create();
        key.ImportFromPem(pem);
        if (key.KeySize != 256)
        {
            key.Dispose();
            throw new CryptographicException($"The record key is EC with {key.KeySize} bits; it must be P-256.");
        }

        return new FileRecordKey(key);
    }

    /// <summary>The private key as PKCS#8 PEM.</summary>
    public string ToPem() => _key.ExportPkcs8PrivateKeyPem();

    public string Mac(string data) => Convert.ToHexStringLower(HMACSHA256.HashData(_macKey, Encoding.UTF8.GetBytes(data)));

    public byte[] Sign(byte[] data)
    {
        lock (_gate)
        {
            return _key.SignData(data, HashAlgorithmName.SHA256, DSASignatureFormat.IeeeP1363FixedFieldConcatenation);
        }
    }

    public void Dispose()
    {
        CryptographicOperations.ZeroMemory(_macKey);
        _key.Dispose();
    }
}
