using System.Security.Cryptography;
using EventReview.Core.Evidence;

namespace EventReview.Data.Auth;

/// <summary>
/// A bearer token for pipelines. Only the SHA-256 of the secret is stored; the secret is shown once at creation.
/// A token can do exactly what its <see cref="Scopes"/> allow (see <see cref="TokenScopes"/>), never sign, and stops
/// working at <see cref="ExpiresAt"/> or when revoked.
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
        Scopes = string.Empty;
    }

    /// <summary>Lifetime when none is chosen (days).</summary>
    public const int DefaultLifetimeDays = 90;

    /// <summary>Longest lifetime a token can be given (days).</summary>
    public const int MaxLifetimeDays = 366;

    public int Id { get; private set; }

    public string Name { get; private set; }

    public string Hash { get; private set; }

    public string Role { get; private set; }

    public string CreatedBy { get; private set; }

    public DateTimeOffset CreatedAt { get; private set; }

    public DateTimeOffset? LastUsedAt { get; private set; }

    public DateTimeOffset? RevokedAt { get; private set; }

    /// <summary>Scopes separated by spaces (<see cref="TokenScopes.Join"/>); read them with <see cref="ScopeList"/>.</summary>
    public string Scopes { get; private set; }

    /// <summary>When the token stops working (UTC).</summary>
    public DateTimeOffset ExpiresAt { get; private set; }

    /// <summary>Not revoked (it may still have expired: use <see cref="StateAt"/>).</summary>
    public bool IsActive => RevokedAt is null;

    /// <summary>The scopes the token carries.</summary>
    public IReadOnlyList<string> ScopeList => TokenScopes.Split(Scopes);

    /// <summary>Revoked wins over expired; otherwise expired from <see cref="ExpiresAt"/> on.</summary>
    public TokenState StateAt(DateTimeOffset now) =>
        RevokedAt is not null ? TokenState.Revoked : now >= ExpiresAt ? TokenState.Expired : TokenState.Active;

    /// <summary>Makes a new token and its secret (the only time the secret exists).</summary>
    /// <param name="scopes">Scopes; null or empty gives <see cref="TokenScopes.Pipeline"/>.</param>
    /// <param name="lifetimeDays">Days until it expires: 1 to <see cref="MaxLifetimeDays"/>; null gives <see cref="DefaultLifetimeDays"/>.</param>
    public static (ApiToken Token, string Secret) Create(string name, string createdBy, DateTimeOffset now, IEnumerable<string>? scopes = null, int? lifetimeDays = null)
    {
        var days = lifetimeDays ?? DefaultLifetimeDays;
        if (days is < 1 or > MaxLifetimeDays)
        {
            throw new ArgumentOutOfRangeException(nameof(lifetimeDays), days, $"A token lives 1 to {MaxLifetimeDays} days.");
        }

        var scopeList = TokenScopes.Parse(scopes);
        name = (name ?? string.Empty).Trim();
        if (name.Length is < 1 or > 100)
        {
            throw new ArgumentException("Token name must be 1-100 characters.", nameof(name));
        }

        // The name is shown as the actor of every change the token makes: what is shown must be what is stored.
        Core.Inputs.InputGuard.Identifier(name, 100, nameof(name));

        var secret = Prefix + Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(24));
        return (new ApiToken { Name = name, Hash = HashOf(secret), Role = Roles.Pipeline, CreatedBy = createdBy, CreatedAt = now,
            Scopes = TokenScopes.Join(scopeList), ExpiresAt = now.AddDays(days) }, secret);
    }

    public static string HashOf(string secret) => Hashing.Sha256Hex(secret);

    public void Revoke(DateTimeOffset now) => RevokedAt ??= now;

    public void Touch(DateTimeOffset now) => LastUsedAt = now;
}
