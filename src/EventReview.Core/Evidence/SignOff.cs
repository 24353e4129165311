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
        SignedAtUtc = Time.RecordedTime.Normalize(atUtc);
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

    /// <summary>When signed, UTC, to whole milliseconds (<see cref="Time.RecordedTime"/>).</summary>
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
    public string Seal() => ComputeSeal(UserId, SignerName, SignedAtUtc.UtcTicks, SignedAtGpsNanoseconds, Meaning.ToString(), Statement, EvidenceFingerprint);

    /// <summary>The seal (see <see cref="Seal"/>) from plain values; <paramref name="meaning"/> is the member name ("Reviewed", "Approved").</summary>
    public static string ComputeSeal(string userId, string signerName, long signedUtcTicks, long signedGpsNanoseconds, string meaning, string statement, string evidenceFingerprint) =>
        Hashing.Sha256Hex(string.Join('\n', "eventreview-signoff-row-v1", userId, signerName,
            signedUtcTicks.ToString(System.Globalization.CultureInfo.InvariantCulture),
            signedGpsNanoseconds.ToString(System.Globalization.CultureInfo.InvariantCulture), meaning, statement, evidenceFingerprint));

    internal void MarkStale(DateTimeOffset at)
    {
        if (!IsStale)
        {
            IsStale = true;
            StaleSince = Time.RecordedTime.Normalize(at);
        }
    }
}
