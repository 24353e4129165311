using System.Globalization;
using System.Text;
using System.Text.Json;
using EventReview.Core.Records;

namespace EventReview.Data.Records;

/// <summary>
/// One line of the witness file (JSON, format <c>eventreview-witness/1</c>): when it was written (UTC, ISO 8601), the
/// fingerprint of the record key that signed it, the heads written by one batch, and the signature (base64 ECDSA P-256 /
/// SHA-256, IEEE P1363) over <see cref="SignedText"/>.
/// </summary>
public sealed record WitnessLine(string Format, string At, string Key, IReadOnlyList<WitnessedHead> Heads, string Signature)
{
    public const string CurrentFormat = "eventreview-witness/1";

    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web) { Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>A signed line for <paramref name="heads"/>.</summary>
    public static WitnessLine Create(IReadOnlyList<WitnessedHead> heads, DateTimeOffset at, IRecordSigner signer)
    {
        var unsigned = new WitnessLine(CurrentFormat, at.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'", CultureInfo.InvariantCulture), signer.KeyId, heads, string.Empty);
        return unsigned with { Signature = Convert.ToBase64String(signer.Sign(unsigned.SignedText())) };
    }

    /// <summary>
    /// What the signature covers, as UTF-8: the lines <c>eventreview-witness-v1</c>, time, key fingerprint, then one line
    /// per head <c>sequence hash chain</c>; every line ends in '\n'.
    /// </summary>
    public byte[] SignedText()
    {
        var sb = new StringBuilder("eventreview-witness-v1\n").Append(At).Append('\n').Append(Key).Append('\n');
        foreach (var h in Heads)
        {
            sb.Append(h.Sequence.ToString(CultureInfo.InvariantCulture)).Append(' ').Append(h.Hash).Append(' ').Append(h.Chain.Replace("\n", " ", StringComparison.Ordinal)).Append('\n');
        }

        return Encoding.UTF8.GetBytes(sb.ToString());
    }

    /// <summary>True when the signature verifies with the listed key of that fingerprint.</summary>
    public bool SignatureValid(IRecordKeyRing keys)
    {
        var key = keys.Keys.FirstOrDefault(k => k.Fingerprint == Key);
        try
        {
            return key is not null && key.Verifies(SignedText(), Convert.FromBase64String(Signature));
        }
        catch (FormatException)
        {
            return false;
        }
    }

    public string ToJson() => JsonSerializer.Serialize(this, Json);

    /// <summary>Reads a line; null when it is not a witness line.</summary>
    public static WitnessLine? Parse(string line)
    {
        try
        {
            var w = JsonSerializer.Deserialize<WitnessLine>(line, Json);
            return w is { Format: CurrentFormat, Heads: not null, Signature: not null, Key: not null, At: not null } && w.Heads.All(h => h is { Chain: not null, Hash: not null }) ? w : null;
        }
        catch (JsonException)
        {
            return null;
        }
    }
}
