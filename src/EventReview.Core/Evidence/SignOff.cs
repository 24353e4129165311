using EventReview.Core.Time;

namespace EventReview.Core.Evidence;

/// <summary>
/// A named reviewer's signature on a checklist item, bound to the evidence fingerprint the signer saw.
/// Never deleted: when the evidence changes afterwards the sign-off becomes stale (<see cref="IsStale"/>).
/// </summary>
public sealed class SignOff
{
    private SignOff()
    {
        UserId = string.Empty;
        SignerName = string.Empty;
        Statement = string.Empty;
        EvidenceFingerprint = string.Empty;
    }

    internal SignOff(Cases.Actor signer, DateTimeOffset atUtc, GpsTime atGps, SignOffMeaning meaning, string statement, string evidenceFingerprint)
    {
        UserId = signer.UserId;
        SignerName = signer.DisplayName;
        SignedAtUtc = atUtc;
        SignedAtGpsNanoseconds = atGps.Nanoseconds;
        Meaning = meaning;
        Statement = statement;
        EvidenceFingerprint = evidenceFingerprint;
    }

    public int Id { get; private set; }

    public int ChecklistItemId { get; private set; }

    public string UserId { get; private set; }

    /// <summary>The signer's printed name at the time of signing.</summary>
    public string SignerName { get; private set; }

    public DateTimeOffset SignedAtUtc { get; private set; }

    /// <summary>Signing time on the GPS scale, nanoseconds.</summary>
    public long SignedAtGpsNanoseconds { get; private set; }

    public GpsTime SignedAtGps => new(SignedAtGpsNanoseconds);

    public SignOffMeaning Meaning { get; private set; }

    public string Statement { get; private set; }

    /// <summary>The item's evidence fingerprint (SHA-256) when signed.</summary>
    public string EvidenceFingerprint { get; private set; }

    /// <summary>Set when the item's evidence changed after signing; the signature then no longer counts.</summary>
    public bool IsStale { get; private set; }

    public DateTimeOffset? StaleSince { get; private set; }

    /// <summary>
    /// SHA-256 over the signature's canonical content (version 1: signer id and name, UTC ticks, GPS nanoseconds,
    /// meaning, statement, evidence fingerprint). Recorded in the case timeline when signing; the stale mark is not part
    /// of it (staleness is recorded by its own timeline entry).
    /// </summary>
    public string Seal() => Hashing.Sha256Hex(string.Join('\n', "eventreview-signoff-row-v1", UserId, SignerName,
        SignedAtUtc.UtcTicks.ToString(System.Globalization.CultureInfo.InvariantCulture),
        SignedAtGpsNanoseconds.ToString(System.Globalization.CultureInfo.InvariantCulture), Meaning.ToString(), Statement, EvidenceFingerprint));

    internal void MarkStale(DateTimeOffset at)
    {
        if (!IsStale)
        {
            IsStale = true;
            StaleSince = at;
        }
    }
}
