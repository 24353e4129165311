using System.Globalization;
using EventReview.Core.Evidence;
using EventReview.Core.Injections;
using EventReview.Core.Records;

namespace EventReview.Data.Auth;

/// <summary>
/// The facts the sign-in audit records about accounts and roles (<c>account[USER-ID].email|name|role</c>), API tokens
/// (<c>token[ID].name|hash|scopes|expires|created|created-by|revoked</c>) and sealed injection records
/// (<c>seal[ID].commitment|label|sealed-by|sealed-by-name|sealed|opened|opened-by|opened-by-name|opened-case|opened-summary|opened-record|opened-salt</c>).
/// Times are UTC ticks truncated to whole milliseconds; texts that may be long are written as their SHA-256. The same
/// builders describe the stored rows, so <see cref="AuditReplay"/> compares like with like.
/// </summary>
public static class AuditFacts
{
    public static IEnumerable<Fact> Account(string userId, string email, string displayName, string role) =>
    [
        new($"account[{userId}].email", email),
        new($"account[{userId}].name", displayName),
        Role(userId, role),
    ];

    public static Fact Role(string userId, string role) => new($"account[{userId}].role", role);

    public static IEnumerable<Fact> Token(ApiToken t) =>
    [
        new(TokenField(t.Id, "name"), t.Name),
        new(TokenField(t.Id, "hash"), t.Hash),
        new(TokenField(t.Id, "scopes"), t.Scopes),
        new(TokenField(t.Id, "expires"), Ms(t.ExpiresAt)),
        new(TokenField(t.Id, "created"), Ms(t.CreatedAt)),
        new(TokenField(t.Id, "created-by"), t.CreatedBy),
        Revoked(t),
    ];

    public static Fact Revoked(ApiToken t) => new(TokenField(t.Id, "revoked"), t.RevokedAt is { } r ? Ms(r) : string.Empty);

    /// <summary>Every field of a sealed record, registered or opened.</summary>
    public static IEnumerable<Fact> Seal(SealedInjectionRecord s)
    {
        string F(string field) => $"seal[{s.Id.ToString(CultureInfo.InvariantCulture)}].{field}";
        yield return new(F("commitment"), s.Commitment);
        yield return new(F("label"), s.Label);
        yield return new(F("sealed-by"), s.SealedById);
        yield return new(F("sealed-by-name"), s.SealedByName);
        yield return new(F("sealed"), Ms(s.SealedAt));
        yield return new(F("opened"), s.OpenedAt is { } o ? Ms(o) : string.Empty);
        yield return new(F("opened-by"), s.OpenedById ?? string.Empty);
        yield return new(F("opened-by-name"), s.OpenedByName ?? string.Empty);
        yield return new(F("opened-case"), s.OpenedInCaseId?.ToString(CultureInfo.InvariantCulture) ?? string.Empty);
        yield return new(F("opened-summary"), s.OpenedSummary is null ? string.Empty : Hashing.Sha256Hex(s.OpenedSummary));
        yield return new(F("opened-record"), s.OpenedRecord is null ? string.Empty : Hashing.Sha256Hex(s.OpenedRecord));
        yield return new(F("opened-salt"), s.OpenedSalt ?? string.Empty);
    }

    private static string TokenField(int id, string field) => $"token[{id.ToString(CultureInfo.InvariantCulture)}].{field}";

    private static string Ms(DateTimeOffset t) => (t.UtcTicks - (t.UtcTicks % TimeSpan.TicksPerMillisecond)).ToString(CultureInfo.InvariantCulture);
}
