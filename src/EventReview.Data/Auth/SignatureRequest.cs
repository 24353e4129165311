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

    public void Use(DateTimeOffset now) => UsedAt = now;
}
