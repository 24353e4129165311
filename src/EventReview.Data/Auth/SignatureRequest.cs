using System.Security.Cryptography;
using EventReview.Core.Evidence;

namespace EventReview.Data.Auth;

/// <summary>
/// A sign-off waiting for its signer to prove who they are at the identity provider (single sign-on accounts): what
/// they are signing (item, meaning, statement, the evidence fingerprint they saw) is kept here while the browser goes
/// to the provider and back, so that only a short random id travels. Used once, within <see cref="Lifetime"/>.
/// </summary>
public sealed class SignatureRequest
{
    /// <summary>How long the signer has to re-authenticate.</summary>
    public static readonly TimeSpan Lifetime = TimeSpan.FromMinutes(10);

    private SignatureRequest()
    {
        Id = string.Empty;
        UserId = string.Empty;
        ItemKey = string.Empty;
        Statement = string.Empty;
        SeenFingerprint = string.Empty;
    }

    /// <summary>32 random hex digits.</summary>
    public string Id { get; private set; }

    public string UserId { get; private set; }

    public int CaseId { get; private set; }

    public string ItemKey { get; private set; }

    public SignOffMeaning Meaning { get; private set; }

    public string Statement { get; private set; }

    public string SeenFingerprint { get; private set; }

    public DateTimeOffset CreatedAt { get; private set; }

    /// <summary>When the request was used (signed or refused); a used request never signs again.</summary>
    public DateTimeOffset? UsedAt { get; private set; }

    /// <summary>True when it ended in a sign-off.</summary>
    public bool Signed { get; private set; }

    /// <summary>What happened, in a sentence for the signer (shown on the item panel when they come back).</summary>
    public string? Outcome { get; private set; }

    /// <summary>Allowed difference between this server's clock and the identity provider's.</summary>
    public static readonly TimeSpan ClockSkew = TimeSpan.FromMinutes(1);

    public static SignatureRequest Create(string userId, int caseId, string itemKey, SignOffMeaning meaning, string statement, string seenFingerprint, DateTimeOffset now) => new()
    {
        Id = Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(16)),
        UserId = userId,
        CaseId = caseId,
        ItemKey = itemKey,
        Meaning = meaning,
        Statement = statement,
        SeenFingerprint = seenFingerprint,
        CreatedAt = now,
    };

    /// <summary>True when it can still be used at <paramref name="now"/>.</summary>
    public bool IsOpen(DateTimeOffset now) => UsedAt is null && now - CreatedAt <= Lifetime;

    /// <summary>Ends the request: signed, or refused with the reason in <paramref name="outcome"/>.</summary>
    public void Use(DateTimeOffset now, bool signed, string outcome)
    {
        UsedAt = now;
        Signed = signed;
        Outcome = outcome.Length <= 500 ? outcome : outcome[..499] + "…";
    }

    /// <summary>
    /// Null when the provider's <paramref name="authTime"/> (its <c>auth_time</c>: when the person last entered their
    /// credentials there) proves a sign-in made for this signature: not before the request was made (less
    /// <see cref="ClockSkew"/>), not older than <paramref name="maxAge"/> now, not in the future. Otherwise the reason.
    /// A provider that ignored <c>prompt=login</c>/<c>max_age=0</c> and reused an earlier session answers with an old time.
    /// </summary>
    public string? ReauthenticationProblem(DateTimeOffset? authTime, DateTimeOffset now, TimeSpan maxAge) =>
        FreshnessProblem(authTime, CreatedAt, now, maxAge);

    /// <summary>
    /// The rule of <see cref="ReauthenticationProblem"/> for a request made at <paramref name="requestedAt"/>: null when
    /// <paramref name="authTime"/> is after the request (less <see cref="ClockSkew"/>), not older than
    /// <paramref name="maxAge"/> at <paramref name="now"/> and not in the future; otherwise the reason.
    /// </summary>
    public static string? FreshnessProblem(DateTimeOffset? authTime, DateTimeOffset requestedAt, DateTimeOffset now, TimeSpan maxAge)
    {
        if (authTime is not { } t)
        {
            return "The identity provider did not say when you signed in there (no auth_time), so the signature cannot be tied to a fresh sign-in. Nothing was signed.";
        }

        if (t > now + ClockSkew)
        {
            return $"The identity provider reported a sign-in at {t.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC, in the future by this server's clock. Nothing was signed; the server's administrators should check the clocks.";
        }

        if (t < requestedAt - ClockSkew || now - t > maxAge)
        {
            return $"The identity provider did not ask for your credentials again: it reported your sign-in at {t.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC, before you asked to sign at {requestedAt.UtcDateTime:HH:mm:ss} UTC. A signature needs a fresh sign-in, so nothing was signed.";
        }

        return null;
    }
}
