using System.Security.Cryptography;

namespace EventReview.Core.Injections;

/// <summary>
/// Hash commitment for a blind-injection record: commitment = lowercase hex SHA-256(salt bytes || record bytes).
/// The random salt stops anyone guessing a short record from the commitment; the record bytes are hashed exactly
/// as given (no newline or encoding normalisation), so the file must be kept byte for byte.
/// </summary>
public static class SealedRecord
{
    /// <summary>Salt length in bytes.</summary>
    public const int SaltBytes = 32;

    /// <summary>Makes a fresh 32-byte salt with <see cref="RandomNumberGenerator"/> and returns the commitment and salt (hex).</summary>
    public static SealResult Seal(byte[] record)
    {
        ArgumentNullException.ThrowIfNull(record);
        var salt = RandomNumberGenerator.GetBytes(SaltBytes);
        return new SealResult(Commitment(salt, record), Convert.ToHexStringLower(salt));
    }

    /// <summary>Lowercase hex SHA-256 of <paramref name="salt"/> followed by <paramref name="record"/>.</summary>
    public static string Commitment(byte[] salt, byte[] record)
    {
        ArgumentNullException.ThrowIfNull(salt);
        ArgumentNullException.ThrowIfNull(record);
        var buffer = new byte[salt.Length + record.Length];
        salt.CopyTo(buffer, 0);
        record.CopyTo(buffer, salt.Length);
        return Convert.ToHexStringLower(SHA256.HashData(buffer));
    }

    /// <summary>
    /// True when the commitment (hex, any case, surrounding white space ignored) equals SHA-256(salt || record).
    /// Compared in constant time.
    /// </summary>
    /// <exception cref="FormatException">When <paramref name="saltHex"/> is not an even-length hex string.</exception>
    public static bool Verify(string commitment, byte[] record, string saltHex)
    {
        ArgumentNullException.ThrowIfNull(commitment);
        ArgumentNullException.ThrowIfNull(saltHex);
        byte[] salt;
        try
        {
            salt = Convert.FromHexString(saltHex.Trim());
        }
        catch (FormatException)
        {
            throw new FormatException("salt must be a hex string (two hex digits per byte)");
        }

        var expected = System.Text.Encoding.ASCII.GetBytes(Commitment(salt, record));
        var given = System.Text.Encoding.ASCII.GetBytes(commitment.Trim().ToLowerInvariant());
        return CryptographicOperations.FixedTimeEquals(expected, given);
    }
}
