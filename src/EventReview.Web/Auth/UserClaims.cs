using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Data.Auth;
using Microsoft.AspNetCore.Identity;

namespace EventReview.Web.Auth;

/// <summary>Claims of our own and the mapping from a signed-in principal to an <see cref="Actor"/>.</summary>
public static class UserClaims
{
    public const string DisplayName = "eventreview:display_name";

    /// <summary>Carried only by API token principals: the token's id.</summary>
    public const string TokenId = "eventreview:token_id";

    /// <summary>One claim per scope of an API token (<see cref="TokenScopes"/>).</summary>
    public const string Scope = "eventreview:scope";

    /// <summary>A signed-in person (cookie), as opposed to an API token.</summary>
    public static bool IsPerson(this ClaimsPrincipal user) => user.Identity?.IsAuthenticated == true && !user.HasClaim(c => c.Type == TokenId);

    /// <summary>An API token principal that carries <paramref name="scope"/>.</summary>
    public static bool HasScope(this ClaimsPrincipal user, string scope) =>
        user.Identity?.IsAuthenticated == true && user.HasClaim(c => c.Type == TokenId) && user.HasClaim(Scope, scope);

    /// <summary>The actor for a principal (user or API token).</summary>
    public static Actor ToActor(this ClaimsPrincipal user) => new(
        user.FindFirstValue(ClaimTypes.NameIdentifier) ?? throw new UnauthorizedAccessException("Not signed in."),
        user.FindFirstValue(DisplayName) ?? user.Identity?.Name ?? "unknown");

    public static bool IsCoordinator(this ClaimsPrincipal user) => user.IsInRole(Roles.Coordinator);

    public static bool CanWork(this ClaimsPrincipal user) => user.IsInRole(Roles.Coordinator) || user.IsInRole(Roles.Reviewer);
}

/// <summary>Adds the display name claim to cookie principals.</summary>
public sealed class AppClaimsFactory(UserManager<AppUser> users, RoleManager<IdentityRole> roles, Microsoft.Extensions.Options.IOptions<IdentityOptions> options)
    : UserClaimsPrincipalFactory<AppUser, IdentityRole>(users, roles, options)
{
    protected override async Task<ClaimsIdentity> GenerateClaimsAsync(AppUser user)
    {
        var id = await base.GenerateClaimsAsync(user);
        id.AddClaim(new Claim(UserClaims.DisplayName, string.IsNullOrWhiteSpace(user.DisplayName) ? user.Email ?? user.Id : user.DisplayName));
        return id;
    }
}
