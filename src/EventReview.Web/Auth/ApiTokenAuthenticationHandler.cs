using System.Security.Claims;
using System.Text.Encodings.Web;
using EventReview.Data;
using EventReview.Data.Auth;
using Microsoft.AspNetCore.Authentication;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Auth;

/// <summary>Authenticates <c>Authorization: Bearer ert_...</c> against the stored token hashes.</summary>
public sealed class ApiTokenAuthenticationHandler(
    IOptionsMonitor<AuthenticationSchemeOptions> options,
    ILoggerFactory logger,
    UrlEncoder encoder,
    IDbContextFactory<AppDbContext> dbFactory,
    TimeProvider clock) : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    public const string SchemeName = "ApiToken";

    protected override async Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        var header = Request.Headers.Authorization.ToString();
        if (!header.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase))
        {
            return AuthenticateResult.NoResult();
        }

        var secret = header["Bearer ".Length..].Trim();
        var hash = ApiToken.HashOf(secret);
        await using var db = await dbFactory.CreateDbContextAsync();
        var token = await db.ApiTokens.FirstOrDefaultAsync(t => t.Hash == hash);
        if (token is null || !token.IsActive)
        {
            return AuthenticateResult.Fail("The API token is unknown or revoked.");
        }

        var now = clock.GetUtcNow();
        if (token.LastUsedAt is null || now - token.LastUsedAt > TimeSpan.FromMinutes(1))
        {
            token.Touch(now);
            await db.SaveChangesAsync();
        }

        var identity = new ClaimsIdentity(
        [
            new Claim(ClaimTypes.NameIdentifier, $"token:{token.Id}"),
            new Claim(ClaimTypes.Name, $"token {token.Name}"),
            new Claim(UserClaims.DisplayName, $"API token '{token.Name}'"),
            new Claim(ClaimTypes.Role, Roles.Pipeline),
        ], SchemeName);
        return AuthenticateResult.Success(new AuthenticationTicket(new ClaimsPrincipal(identity), SchemeName));
    }
}
