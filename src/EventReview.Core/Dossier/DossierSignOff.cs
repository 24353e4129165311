namespace EventReview.Core.Dossier;

/// <summary>
/// A sign-off: signer, meaning ("reviewed" or "approved"), statement, time (UTC text and ticks; GPS nanoseconds and
/// seconds text), the evidence fingerprint signed against, and whether (and since when) it is stale.
/// </summary>
public sealed record DossierSignOff(
    long Id,
    string UserId,
    string SignerName,
    string Meaning,
    string Statement,
    string SignedAtUtc,
    long SignedAtUtcTicks,
    long SignedAtGpsNanoseconds,
    string SignedAtGps,
    string EvidenceFingerprint,
    bool IsStale,
    string? StaleSinceUtc,
    long? StaleSinceUtcTicks);
