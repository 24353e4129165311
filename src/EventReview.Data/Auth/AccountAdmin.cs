using System.Security.Cryptography;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Auth;

/// <summary>
/// Accounts, roles and API tokens: shared by the web app (team and tokens pages) and the CLI. Each change commits together
/// with its sign-in audit entry, whose facts (<see cref="AuditFacts"/>) let verification recompute accounts, roles and
/// token scopes.
/// </summary>
public sealed class AccountAdmin(UserManager<AppUser> users, RoleManager<IdentityRole> roles, AppDbContext identityDb, IDbContextFactory<AppDbContext> dbFactory, TimeProvider clock, AccountAudit audit, TokenRevocations revocations)
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
        await using var held = await audit.HoldAsync();
        await using var tx = await identityDb.Database.BeginTransactionAsync();
        var created = await users.CreateAsync(user, password);
        if (!created.Succeeded)
        {
            throw new ArgumentException("password: " + string.Join(" ", created.Errors.Select(e => e.Description)), nameof(password));
        }

        await users.AddToRoleAsync(user, role);
        await audit.RecordInAsync(identityDb, AccountEventKinds.AccountCreated, user.Id, email, null, $"role {role}", AuditFacts.Account(user.Id, email, user.DisplayName, role));
        await tx.CommitAsync();
        return (user, password, generated);
    }

    /// <summary>
    /// Makes the account of a person vouched for by single sign-on, joined to their provider <paramref name="login"/>,
    /// with <paramref name="role"/>; the sign-in audit records it with its facts, in the same transaction.
    /// </summary>
    public async Task<AppUser> CreateExternalAsync(string email, string displayName, UserLoginInfo login, string role, string detail, string? address)
    {
        ArgumentNullException.ThrowIfNull(login);
        if (!Roles.IsKnown(role))
        {
            throw new ArgumentException($"Unknown role '{role}'.", nameof(role));
        }

        var user = new AppUser { UserName = email, Email = email, EmailConfirmed = true, DisplayName = displayName };
        await using var held = await audit.HoldAsync();
        await using var tx = await identityDb.Database.BeginTransactionAsync();
        Ensure(await users.CreateAsync(user), "create the account");
        Ensure(await users.AddLoginAsync(user, login), "link the account");
        Ensure(await users.AddToRoleAsync(user, role), "give the role");
        await audit.RecordInAsync(identityDb, AccountEventKinds.AccountCreated, user.Id, email, address, detail, AuditFacts.Account(user.Id, email, user.DisplayName, role));
        await tx.CommitAsync();
        return user;
    }

    private static void Ensure(IdentityResult result, string what)
    {
        if (!result.Succeeded)
        {
            throw new InvalidOperationException($"Could not {what}: {string.Join(" ", result.Errors.Select(e => e.Description))}");
        }
    }

    /// <summary>Replaces a user's role; <paramref name="detail"/> says why (default: the old and new role).</summary>
    public async Task SetRoleAsync(string userId, string role, string? detail = null, string? address = null)
    {
        if (!Roles.IsKnown(role))
        {
            throw new ArgumentException($"Unknown role '{role}'.", nameof(role));
        }

        var user = await users.FindByIdAsync(userId) ?? throw new KeyNotFoundException($"No user with id {userId}.");
        var current = await users.GetRolesAsync(user);
        await using var held = await audit.HoldAsync();
        await using var tx = await identityDb.Database.BeginTransactionAsync();
        await users.RemoveFromRolesAsync(user, current);
        await users.AddToRoleAsync(user, role);
        await audit.RecordInAsync(identityDb, AccountEventKinds.RoleChanged, user.Id, user.Email, address, detail ?? $"role {string.Join(",", current)} to {role}", [AuditFacts.Role(user.Id, role)]);
        await tx.CommitAsync();
    }

    /// <summary>The facts of the stored accounts with their roles, tokens and sealed records (compared with the audit by <see cref="AuditReplay"/>).</summary>
    public static async Task<IReadOnlyList<EventReview.Core.Records.Fact>> StoredFactsAsync(AppDbContext db, CancellationToken ct = default)
    {
        var roleNames = await db.Roles.AsNoTracking().ToDictionaryAsync(r => r.Id, r => r.Name ?? string.Empty, ct);
        var userRoles = (await db.UserRoles.AsNoTracking().ToListAsync(ct)).ToLookup(r => r.UserId, r => roleNames.GetValueOrDefault(r.RoleId, r.RoleId));
        var facts = new List<EventReview.Core.Records.Fact>();
        foreach (var u in await db.Users.AsNoTracking().ToListAsync(ct))
        {
            facts.AddRange(AuditFacts.Account(u.Id, u.Email ?? string.Empty, u.DisplayName, string.Join(",", userRoles[u.Id].Order(StringComparer.Ordinal))));
        }

        foreach (var t in await db.ApiTokens.AsNoTracking().ToListAsync(ct))
        {
            facts.AddRange(AuditFacts.Token(t));
        }

        foreach (var s in await db.SealedInjectionRecords.AsNoTracking().ToListAsync(ct))
        {
            facts.AddRange(AuditFacts.Seal(s));
        }

        return facts;
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
        var (token, secret) = ApiToken.Create(name, createdBy, EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow()), scopes, lifetimeDays);
        await using var db = await dbFactory.CreateDbContextAsync();
        await using var held = await audit.HoldAsync();
        await using var tx = await db.Database.BeginTransactionAsync();
        db.ApiTokens.Add(token);
        await db.SaveChangesAsync();
        await audit.RecordInAsync(db, AccountEventKinds.TokenCreated, null, createdBy, address,
            $"token {token.Id} '{token.Name}' scopes [{token.Scopes}] expires {token.ExpiresAt.UtcDateTime:yyyy-MM-dd HH:mm} UTC", AuditFacts.Token(token));
        await tx.CommitAsync();
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
        await using var held = await audit.HoldAsync();
        await using var tx = await db.Database.BeginTransactionAsync();
        token.Revoke(EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow()));
        await db.SaveChangesAsync();
        await audit.RecordInAsync(db, AccountEventKinds.TokenRevoked, null, revokedBy, address, $"token {token.Id} '{token.Name}'", [AuditFacts.Revoked(token)]);
        await tx.CommitAsync();
        revocations.Revoked();
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
