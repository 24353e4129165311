using System.Security.Cryptography;
using System.Text.Json;
using EventReview.Core.Records;

namespace EventReview.Data.Records;

/// <summary>
/// Reads trusted record public keys from a file: PEM (<c>-----BEGIN PUBLIC KEY-----</c>, one or more), or JSON with a
/// <c>keys</c> list whose entries carry <c>publicKey</c> (base64 DER) and optionally <c>validFrom</c>/<c>validUntil</c>
/// (what <c>/api/signing-key</c> answers, and the key folder's <c>record-keys.json</c>).
/// </summary>
public static class PublicKeyFile
{
    /// <summary>
    /// The public key list as JSON: <c>{format, current, keys: [{fingerprint, algorithm, publicKey, publicKeyPem, validFrom,
    /// validUntil}]}</c> (what <c>/api/signing-key</c> answers and <c>eventreview keys export</c> writes; <see cref="Read"/> reads it).
    /// </summary>
    public static object Describe(IRecordKeyRing keys)
    {
        ArgumentNullException.ThrowIfNull(keys);
        return new
        {
            format = FileRecordKeyRing.Format,
            current = keys.Keys.LastOrDefault(k => k.ValidUntil is null)?.Fingerprint,
            keys = keys.Keys.Select(k => new
            {
                fingerprint = k.Fingerprint,
                algorithm = RecordPublicKey.Algorithm,
                publicKey = Convert.ToBase64String(k.SubjectPublicKeyInfo),
                publicKeyPem = k.Pem(),
                validFrom = k.ValidFrom,
                validUntil = k.ValidUntil,
            }),
        };
    }

    /// <exception cref="InvalidDataException">When the file holds no P-256 public key (the message says what it found).</exception>
    public static IReadOnlyList<RecordPublicKey> Read(string path)
    {
        var text = File.ReadAllText(path);
        var keys = new List<RecordPublicKey>();
        try
        {
            if (text.TrimStart().StartsWith("-----BEGIN", StringComparison.Ordinal))
            {
                var rest = text.AsSpan();
                while (PemEncoding.TryFind(rest, out var fields))
                {
                    keys.Add(RecordPublicKey.FromPem(rest[fields.Location].ToString(), DateTimeOffset.MinValue));
                    rest = rest[fields.Location.End..];
                }
            }
            else
            {
                using var json = JsonDocument.Parse(text);
                foreach (var k in json.RootElement.GetProperty("keys").EnumerateArray())
                {
                    var from = k.TryGetProperty("validFrom", out var f) && f.ValueKind == JsonValueKind.String ? f.GetDateTimeOffset() : DateTimeOffset.MinValue;
                    DateTimeOffset? until = k.TryGetProperty("validUntil", out var u) && u.ValueKind == JsonValueKind.String ? u.GetDateTimeOffset() : null;
                    var spki = Convert.FromBase64String(k.GetProperty("publicKey").GetString() ?? string.Empty);
                    using var check = ECDsa.Create();
                    check.ImportSubjectPublicKeyInfo(spki, out _);
                    keys.Add(new RecordPublicKey(spki, from, until));
                }
            }
        }
        catch (Exception ex) when (ex is JsonException or KeyNotFoundException or FormatException or CryptographicException or InvalidOperationException or ArgumentException)
        {
            throw new InvalidDataException($"{path} is not a record public key (PEM, or JSON with a \"keys\" list): {ex.Message}", ex);
        }

        return keys.Count > 0 ? keys : throw new InvalidDataException($"{path} holds no public key.");
    }
}
