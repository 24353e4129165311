using System.Security.Cryptography;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Auth;

/// <summary>Accounts, roles and API tokens: shared by the web app (team and tokens pages) and the CLI.</summary>
public sealed class AccountAdmin(UserManager<AppUser> users, RoleManager<IdentityRole> roles, IDbContextFactory<AppDbContext> dbFactory, TimeProvider clock, AccountAudit audit, TokenRevocations revocations)
{
    /// <summary>Creates the three roles when missing.</summary>
    public async Task EnsureRolesAsync()
    {
        foreach (var role in Roles.All)
        {
            if (!await roles.RoleExistsAsync(role))
            {
                await roles.CreateAsync(new IdentityRole(role));
            }
        }
    }

    /// <summary>Creates a local account; generates a password when none is given. Returns the password used.</summary>
    /// <exception cref="ArgumentException">When the email, role or password is unacceptable (message names which).</exception>
    public async Task<(AppUser User, string Password, bool Generated)> CreateUserAsync(string email, string role, string? password, string? displayName)
    {
        email = (email ?? string.Empty).Trim();
        if (!email.Contains('@', StringComparison.Ordinal) || email.Length > 254)
        {
            throw new ArgumentException($"'{(email.Length > 60 ? email[..60] + "..." : email)}' is not an email address (at most 254 characters, with an @).", nameof(email));
        }

        // Names and addresses are shown in the timeline and the sign-in audit: no hidden or reordering characters.
        Core.Inputs.InputGuard.Identifier(email, 254, nameof(email));
        if (!string.IsNullOrWhiteSpace(displayName))
        {
            displayName = Core.Inputs.InputGuard.Identifier(displayName, Core.Inputs.InputLimits.MaxNameLength, nameof(displayName));
        }

        if (!Roles.IsKnown(role))
        {
            throw new ArgumentException($"Unknown role '{role}'; use one of {string.Join(", ", Roles.All)}.", nameof(role));
        }

        if (await users.FindByEmailAsync(email) is not null)
        {
            throw new ArgumentException($"An account for {email} already exists.", nameof(email));
        }

        await EnsureRolesAsync();
        var generated = string.IsNullOrEmpty(password);
        password = generated ? GeneratePassword() : password!;
        var user = new AppUser
        {
            UserName = email,
            Email = email,
            EmailConfirmed = true,
            DisplayName = string.IsNullOrWhiteSpace(displayName) ? email.Split('@')[0] : displayName.Trim(),
        };
        var created = await users.CreateAsync(user, password);
        if (!created.Succeeded)
        {
            throw new ArgumentException("password: " + string.Join(" ", created.Errors.Select(e => e.Description)), nameof(password));
        }

        await users.AddToRoleAsync(user, role);
        return (user, password, generated);
    }

    /// <summary>Replaces a user's role.</summary>
    public async Task SetRoleAsync(string userId, string role)
    {
        if (!Roles.IsKnown(role))
        {
            throw new ArgumentException($"Unknown role '{role}'.", nameof(role));
        }

        var user = await users.FindByIdAsync(userId) ?? throw new KeyNotFoundException($"No user with id {userId}.");
        var current = await users.GetRolesAsync(user);
        await users.RemoveFromRolesAsync(user, current);
        await users.AddToRoleAsync(user, role);
    }

    /// <summary>All accounts with their role, by display name.</summary>
    public async Task<IReadOnlyList<(AppUser User, string Role)>> ListUsersAsync()
    {
        var list = new List<(AppUser, string)>();
        foreach (var u in await users.Users.OrderBy(u => u.DisplayName).ToListAsync())
        {
            list.Add((u, (await users.GetRolesAsync(u)).FirstOrDefault() ?? "(none)"));
        }

        return list;
    }

    /// <summary>
    /// Creates an API token; the secret is returned once and only its hash is stored. Null or empty scopes give
    /// <see cref="TokenScopes.Pipeline"/>; a null lifetime gives <see cref="ApiToken.DefaultLifetimeDays"/>. The creation
    /// goes into the sign-in audit (name, scopes, expiry; never the secret).
    /// </summary>
    /// <exception cref="ArgumentException">Bad name, unknown scope or a lifetime outside 1 to <see cref="ApiToken.MaxLifetimeDays"/> days.</exception>
    public async Task<(ApiToken Token, string Secret)> CreateTokenAsync(string name, string createdBy, IEnumerable<string>? scopes = null, int? lifetimeDays = null, string? address = null)
    {
        var (token, secret) = ApiToken.Create(name, createdBy, clock.GetUtcNow(), scopes, lifetimeDays);
        await using var db = await dbFactory.CreateDbContextAsync();
        db.ApiTokens.Add(token);
        await db.SaveChangesAsync();
        await audit.RecordAsync(AccountEventKinds.TokenCreated, null, createdBy, address,
            $"token {token.Id} '{token.Name}' scopes [{token.Scopes}] expires {token.ExpiresAt.UtcDateTime:yyyy-MM-dd HH:mm} UTC");
        return (token, secret);
    }

    public async Task<IReadOnlyList<ApiToken>> ListTokensAsync()
    {
        await using var db = await dbFactory.CreateDbContextAsync();
        return (await db.ApiTokens.AsNoTracking().ToListAsync()).OrderByDescending(t => t.CreatedAt).ToList();
    }

    /// <summary>Revokes a token (at once, for every later request) and records it in the sign-in audit.</summary>
    public async Task RevokeTokenAsync(int id, string revokedBy = "command line", string? address = null)
    {
        await using var db = await dbFactory.CreateDbContextAsync();
        var token = await db.ApiTokens.FirstOrDefaultAsync(t => t.Id == id) ?? throw new KeyNotFoundException($"No API token with id {id}.");
        token.Revoke(clock.GetUtcNow());
        await db.SaveChangesAsync();
        revocations.Revoked();
        await audit.RecordAsync(AccountEventKinds.TokenRevoked, null, revokedBy, address, $"token {token.Id} '{token.Name}'");
    }

    /// <summary>A 20-character random password with upper, lower, digit and symbol.</summary>
    public static string GeneratePassword()
    {
        const string upper = "ABCDEFGHJKLMNPQRSTUVWXYZ", lower = "abcdefghijkmnopqrstuvwxyz", digits = "23456789", symbols = "-_.!+=";
        const string all = upper + lower + digits + symbols;
        var chars = new char[20];
        chars[0] = upper[RandomNumberGenerator.GetInt32(upper.Length)];
        chars[1] = lower[RandomNumberGenerator.GetInt32(lower.Length)];
        chars[2] = digits[RandomNumberGenerator.GetInt32(digits.Length)];
        chars[3] = symbols[RandomNumberGenerator.GetInt32(symbols.Length)];
        for (var i = 4; i < chars.Length; i++)
        {
            chars[i] = all[RandomNumberGenerator.GetInt32(all.Length)];
        }

        RandomNumberGenerator.Shuffle(chars.AsSpan());
        return new string(chars);
    }
}
