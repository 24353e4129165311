using System.Security.Cryptography;

namespace EventReview.Core.Records;

/// <summary>The fingerprint that names a record key: lowercase hex SHA-256 of its DER SubjectPublicKeyInfo (64 digits).</summary>
public static class RecordKeyFingerprint
{
    public static string Of(byte[] subjectPublicKeyInfo) => Convert.ToHexStringLower(SHA256.HashData(subjectPublicKeyInfo));

    /// <summary>The first 16 digits in groups of four ("a1b2 c3d4 e5f6 0718"), for people to compare.</summary>
    public static string Short(string fingerprint) =>
        fingerprint.Length < 16 ? fingerprint : string.Join(' ', Enumerable.Range(0, 4).Select(k => fingerprint.Substring(k * 4, 4)));
}
