using System.Security.Cryptography;
using System.Text;
using EventReview.Core.Records;

namespace EventReview.TestSupport;

/// <summary>A record key for tests: a P-256 key made once per run, its MAC key derived as the key folder derives it, and a ring holding it.</summary>
public sealed class TestSigner : IRecordSigner, IRecordKeyRing
{
    private readonly ECDsa _key = ECDsa.Create(ECCurve.NamedCurves.nistP256);
    private readonly byte[] _mac;

    private TestSigner()
    {
        PublicKey = _key.ExportSubjectPublicKeyInfo();
        KeyId = RecordKeyFingerprint.Of(PublicKey);
        _mac = HKDF.DeriveKey(HashAlgorithmName.SHA256, _key.ExportParameters(true).D!, 32, [], Encoding.ASCII.GetBytes("eventreview-entry-mac-v1"));
        Public = new RecordPublicKey(PublicKey, new DateTimeOffset(2030, 1, 1, 0, 0, 0, TimeSpan.Zero), null);
    }

    /// <summary>The key every test of this run signs with.</summary>
    public static TestSigner Instance { get; } = new();

    /// <summary>Another key (a forger's).</summary>
    public static TestSigner Other() => new();

    public string KeyId { get; }

    public byte[] PublicKey { get; }

    public RecordPublicKey Public { get; }

    public IRecordSigner? Current => this;

    public IReadOnlyList<RecordPublicKey> Keys => [Public];

    public string Mac(string data) => Convert.ToHexStringLower(HMACSHA256.HashData(_mac, Encoding.UTF8.GetBytes(data)));

    public byte[] Sign(byte[] data) => _key.SignData(data, HashAlgorithmName.SHA256, DSASignatureFormat.IeeeP1363FixedFieldConcatenation);

    public bool? MacMatches(string keyId, string data, string mac) => keyId == KeyId ? Mac(data) == mac : null;
}
