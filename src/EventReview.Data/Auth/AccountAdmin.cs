using System.Security.Cryptography;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Auth;

/// <summary>Accounts, roles and API tokens: shared by the web app (team and tokens pages) and the CLI.</summary>
public sealed class AccountAdmin(UserManager<AppUser> users, RoleManager<IdentityRole> roles, IDbContextFactory<AppDbContext> dbFactory, TimeProvider clock)
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
        if (!email.Contains('@', StringComparison.Ordinal) || email.Length > 256)
        {
            throw new ArgumentException($"'{email}' is not an email address.", nameof(email));
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

    /// <summary>Creates an API token; the secret is returned once and only its hash is stored.</summary>
    public async Task<(ApiToken Token, string Secret)> CreateTokenAsync(string name, string createdBy)
    {
        var (token, secret) = ApiToken.Create(name, createdBy, clock.GetUtcNow());
        await using var db = await dbFactory.CreateDbContextAsync();
        db.ApiTokens.Add(token);
        await db.SaveChangesAsync();
        return (token, secret);
    }

    public async Task<IReadOnlyList<ApiToken>> ListTokensAsync()
    {
        await using var db = await dbFactory.CreateDbContextAsync();
        return (await db.ApiTokens.AsNoTracking().ToListAsync()).OrderByDescending(t => t.CreatedAt).ToList();
    }

    public async Task RevokeTokenAsync(int id)
    {
        await using var db = await dbFactory.CreateDbContextAsync();
        var token = await db.ApiTokens.FirstOrDefaultAsync(t => t.Id == id) ?? throw new KeyNotFoundException($"No API token with id {id}.");
        token.Revoke(clock.GetUtcNow());
        await db.SaveChangesAsync();
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
