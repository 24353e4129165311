using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace EventReview.Core.Notifications;

/// <summary>
/// The signature on every webhook request (see docs/operations.md "Webhooks"). The sender puts the Unix time in
/// seconds in <see cref="TimestampHeader"/> and <c>sha256=</c> followed by the lowercase hex HMAC-SHA-256 (RFC 2104 with
/// SHA-256) of the UTF-8 bytes of <c>{timestamp}.{body}</c> under the person's webhook secret in
/// <see cref="SignatureHeader"/>. The timestamp inside the signed text stops an old request from being replayed later.
/// </summary>
public static class WebhookSignature
{
    /// <summary>HTTP header holding <c>sha256=</c> and the lowercase hex HMAC-SHA-256 of the signed text.</summary>
    public const string SignatureHeader = "X-EventReview-Signature";

    /// <summary>HTTP header holding the sending time, Unix seconds (UTC), which is part of the signed text.</summary>
    public const string TimestampHeader = "X-EventReview-Timestamp";

    /// <summary>Largest clock difference a receiver should accept (5 minutes: common practice for signed webhooks).</summary>
    public static readonly TimeSpan Tolerance = TimeSpan.FromMinutes(5);

    /// <summary>The signed text: the Unix time in seconds, a full stop, then the body exactly as sent.</summary>
    public static string SignedText(long unixSeconds, string body) =>
        unixSeconds.ToString(CultureInfo.InvariantCulture) + "." + body;

    /// <summary>Lowercase hex HMAC-SHA-256 of <paramref name="message"/> under <paramref name="key"/> (both as bytes).</summary>
    public static string HmacSha256Hex(byte[] key, byte[] message) => Convert.ToHexStringLower(HMACSHA256.HashData(key, message));

    /// <summary>The value of <see cref="SignatureHeader"/> for a body sent at <paramref name="unixSeconds"/>.</summary>
    public static string Sign(string secret, long unixSeconds, string body) =>
        "sha256=" + HmacSha256Hex(Encoding.UTF8.GetBytes(secret), Encoding.UTF8.GetBytes(SignedText(unixSeconds, body)));

    /// <summary>
    /// What a receiver does: true when <paramref name="signatureHeader"/> matches the body and timestamp and the
    /// timestamp is within <see cref="Tolerance"/> of <paramref name="now"/>. Compares in constant time.
    /// </summary>
    public static bool Verify(string secret, string? timestampHeader, string? signatureHeader, string body, DateTimeOffset now)
    {
        if (!long.TryParse(timestampHeader, NumberStyles.None, CultureInfo.InvariantCulture, out var t) || signatureHeader is null)
        {
            return false;
        }

        if (Math.Abs(now.ToUnixTimeSeconds() - t) > Tolerance.TotalSeconds)
        {
            return false;
        }

        var expected = Encoding.ASCII.GetBytes(Sign(secret, t, body));
        var given = Encoding.ASCII.GetBytes(signatureHeader.Trim());
        return CryptographicOperations.FixedTimeEquals(expected, given);
    }
}
