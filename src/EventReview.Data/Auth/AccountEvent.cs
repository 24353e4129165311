using System.Globalization;
using System.Text;
using EventReview.Core.Evidence;
using EventReview.Core.Records;

namespace EventReview.Data.Auth;

/// <summary>
/// One entry of the sign-in audit: sign-ins (succeeded, failed, locked out), sign-outs and token changes. Entries form
/// one hash chain (each hash covers the previous one) and the table is append-only (database triggers). Each entry also
/// carries the facts of what it changed (accounts and roles, tokens and scopes, sealed injection records; replayed by
/// <see cref="AuditReplay"/>) and a MAC under the server's record key. Never holds a password or a token secret.
/// </summary>
public sealed class AccountEvent
{
    /// <summary>Hash before the first entry (64 zeros).</summary>
    public const string GenesisHash = "0000000000000000000000000000000000000000000000000000000000000000";

    /// <summary>Longest account text kept (an email as typed is cut to this length).</summary>
    public const int MaxAccountLength = 120;

    private AccountEvent()
    {
        Kind = string.Empty;
        Account = string.Empty;
        Address = string.Empty;
        Detail = string.Empty;
        PreviousHash = string.Empty;
        Hash = string.Empty;
    }

    public long Id { get; private set; }

    /// <summary>1, 2, 3, ... over the whole table.</summary>
    public long Sequence { get; private set; }

    /// <summary>When, UTC, to whole milliseconds.</summary>
    public DateTimeOffset At { get; private set; }

    /// <summary>One of <see cref="AccountEventKinds"/>.</summary>
    public string Kind { get; private set; }

    /// <summary>The account's user id when known (null for a failed sign-in with an unknown email).</summary>
    public string? UserId { get; private set; }

    /// <summary>Email as typed (cut to <see cref="MaxAccountLength"/>, control characters removed) or a display name.</summary>
    public string Account { get; private set; }

    /// <summary>Client address as the server saw it, or empty when not from a web request (CLI).</summary>
    public string Address { get; private set; }

    /// <summary>Short free text (e.g. the token name and scopes); never a secret.</summary>
    public string Detail { get; private set; }

    public string PreviousHash { get; private set; }

    public string Hash { get; private set; }

    /// <summary>Facts in <see cref="FactText"/> form (empty for sign-ins); null only for entries of canonical version 1.</summary>
    public string? Facts { get; private set; }

    /// <summary>Fingerprint of the record key whose MAC the entry carries; null when not signed.</summary>
    public string? KeyId { get; private set; }

    /// <summary>HMAC-SHA-256 of <see cref="EntryMac.Input"/> (chain <see cref="EntryMac.AuditChain"/>); null when not signed.</summary>
    public string? Mac { get; private set; }

    /// <summary>Signs the entry (once, before it is stored).</summary>
    public void Authenticate(IRecordSigner signer)
    {
        ArgumentNullException.ThrowIfNull(signer);
        if (KeyId is not null)
        {
            throw new InvalidOperationException($"Sign-in audit entry {Sequence} is already signed.");
        }

        KeyId = signer.KeyId;
        Mac = signer.Mac(EntryMac.Input(KeyId, EntryMac.AuditChain, Hash));
    }

    /// <summary>True or false, or null when unsigned or signed by a key the ring does not hold.</summary>
    public bool? MacMatches(IRecordKeyRing keys) =>
        KeyId is null || Mac is null ? null : keys.MacMatches(KeyId, EntryMac.Input(KeyId, EntryMac.AuditChain, Hash), Mac);

    /// <summary>Makes the next entry after <paramref name="previousHash"/> (the chain's last hash, or <see cref="GenesisHash"/>).</summary>
    public static AccountEvent Next(long sequence, string previousHash, DateTimeOffset at, string kind, string? userId, string? account, string? address, string? detail,
        IEnumerable<Fact>? facts = null)
    {
        var e = new AccountEvent
        {
            Sequence = sequence,
            At = new DateTimeOffset(at.UtcTicks - (at.UtcTicks % TimeSpan.TicksPerMillisecond), TimeSpan.Zero),
            Kind = kind,
            UserId = userId,
            Account = Clean(account, MaxAccountLength),
            Address = Clean(address, 64),
            Detail = Clean(detail, 300),
            PreviousHash = previousHash,
            Facts = FactText.Format(facts ?? []),
        };
        e.Hash = e.ComputeHash();
        return e;
    }

    /// <summary>True when the stored hash matches the content.</summary>
    public bool HashMatches() => string.Equals(Hash, ComputeHash(), StringComparison.Ordinal);

    /// <summary>
    /// Lowercase hex SHA-256 of the canonical content. Version 1 (no facts): the lines <c>eventreview-account-v1</c>,
    /// sequence, UTC time (7 fractional digits), kind, user id, account, address, detail, previous hash, joined by '\n'.
    /// Version 2 (with facts): the line <c>eventreview-account-v2</c>, then the same fields and the facts before the
    /// previous hash, each as its length, ':', the value and '\n'.
    /// </summary>
    public string ComputeHash()
    {
        if (Facts is null)
        {
            return ComputeHashV1();
        }

        var sb = new StringBuilder("eventreview-account-v2\n");
        foreach (var field in new[] { Sequence.ToString(CultureInfo.InvariantCulture), At.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'", CultureInfo.InvariantCulture),
            Kind, UserId ?? string.Empty, Account, Address, Detail, Facts, PreviousHash })
        {
            sb.Append(field.Length.ToString(CultureInfo.InvariantCulture)).Append(':').Append(field).Append('\n');
        }

        return Hashing.Sha256Hex(sb.ToString());
    }

    private string ComputeHashV1() => Hashing.Sha256Hex(string.Join('\n',
        "eventreview-account-v1",
        Sequence.ToString(CultureInfo.InvariantCulture),
        At.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'", CultureInfo.InvariantCulture),
        Kind,
        UserId ?? string.Empty,
        Account,
        Address,
        Detail,
        PreviousHash));

    private static string Clean(string? text, int max)
    {
        var s = new string((text ?? string.Empty).Where(c => !char.IsControl(c)).ToArray()).Trim();
        return s.Length <= max ? s : s[..max];
    }
}
