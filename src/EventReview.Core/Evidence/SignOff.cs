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

    internal void MarkStale(DateTimeOffset at)
    {
        if (!IsStale)
        {
            IsStale = true;
            StaleSince = at;
        }
    }
}
