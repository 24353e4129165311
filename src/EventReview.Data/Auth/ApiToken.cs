using System.Security.Cryptography;
using EventReview.Core.Evidence;

namespace EventReview.Data.Auth;

/// <summary>
/// A bearer token for pipelines. Only the SHA-256 of the secret is stored; the secret is shown once at creation.
/// Tokens act as a search pipeline (<see cref="Roles.Pipeline"/>: read, open cases, add evidence; never sign) and can be revoked.
/// </summary>
public sealed class ApiToken
{
    /// <summary>Prefix of every secret, so that leaked tokens are easy to spot.</summary>
    public const string Prefix = "ert_";

    private ApiToken()
    {
        Name = string.Empty;
        Hash = string.Empty;
        Role = Roles.Pipeline;
        CreatedBy = string.Empty;
    }

    public int Id { get; private set; }

    public string Name { get; private set; }

    public string Hash { get; private set; }

    public string Role { get; private set; }

    public string CreatedBy { get; private set; }

    public DateTimeOffset CreatedAt { get; private set; }

    public DateTimeOffset? LastUsedAt { get; private set; }

    public DateTimeOffset? RevokedAt { get; private set; }

    public bool IsActive => RevokedAt is null;

    /// <summary>Makes a new token and its secret (the only time the secret exists).</summary>
    public static (ApiToken Token, string Secret) Create(string name, string createdBy, DateTimeOffset now)
    {
        name = (name ?? string.Empty).Trim();
        if (name.Length is < 1 or > 100)
        {
            throw new ArgumentException("Token name must be 1-100 characters.", nameof(name));
        }

        var secret = Prefix + Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(24));
        return (new ApiToken { Name = name, Hash = HashOf(secret), Role = Roles.Pipeline, CreatedBy = createdBy, CreatedAt = now }, secret);
    }

    public static string HashOf(string secret) => Hashing.Sha256Hex(secret);

    public void Revoke(DateTimeOffset now) => RevokedAt ??= now;

    public void Touch(DateTimeOffset now) => LastUsedAt = now;
}
