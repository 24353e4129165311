using System.Security.Cryptography;
using System.Text;

namespace EventReview.Core.Evidence;

/// <summary>SHA-256 helpers; every hash in EventReview is lowercase hex of SHA-256.</summary>
public static class Hashing
{
    /// <summary>SHA-256 of the UTF-8 bytes of <paramref name="text"/>, lowercase hex.</summary>
    public static string Sha256Hex(string text) => Sha256Hex(Encoding.UTF8.GetBytes(text));

    /// <summary>SHA-256 of <paramref name="bytes"/>, lowercase hex.</summary>
    public static string Sha256Hex(ReadOnlySpan<byte> bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));

    /// <summary>SHA-256 of a stream read to its end, lowercase hex.</summary>
    public static string Sha256Hex(Stream stream) => Convert.ToHexStringLower(SHA256.HashData(stream));

    /// <summary>True for exactly 64 lowercase hex digits.</summary>
    public static bool IsSha256Hex(string? value) =>
        value is { Length: 64 } && value.All(c => c is (>= '0' and <= '9') or (>= 'a' and <= 'f'));
}
