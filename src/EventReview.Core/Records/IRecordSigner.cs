namespace EventReview.Core.Records;

/// <summary>
/// The server's record key, able to sign: an ECDSA P-256 key pair and an entry MAC key derived from it. Implemented by
/// the key folder (<c>EventReview.Data.Records.FileRecordKeyRing</c>); a key held by the operating system or a key vault
/// implements the same two operations without handing out the private key.
/// </summary>
public interface IRecordSigner
{
    /// <summary>Fingerprint of the public key (<see cref="RecordKeyFingerprint.Of"/>), written next to every signature.</summary>
    string KeyId { get; }

    /// <summary>The public key as DER SubjectPublicKeyInfo.</summary>
    byte[] PublicKey { get; }

    /// <summary>HMAC-SHA-256 of the UTF-8 bytes of <paramref name="data"/> under the entry MAC key, lowercase hex.</summary>
    string Mac(string data);

    /// <summary>ECDSA P-256 signature with SHA-256 over <paramref name="data"/>, IEEE P1363 form (r then s, 64 bytes).</summary>
    byte[] Sign(byte[] data);
}
