using System.Security.Claims;
using EventReview.Data.Auth;
using EventReview.Web.Auth;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>Principals for calling services directly (arranging state), shaped like the app's own.</summary>
public static class Principals
{
    public static ClaimsPrincipal Reviewer(string id, string name) => Make(id, name, Roles.Reviewer);

    public static ClaimsPrincipal Coordinator(string id, string name) => Make(id, name, Roles.Coordinator);

    public static ClaimsPrincipal Make(string id, string name, string role) => new(new ClaimsIdentity(
    [
        new Claim(ClaimTypes.NameIdentifier, id),
        new Claim(ClaimTypes.Name, name),
        new Claim(UserClaims.DisplayName, name),
        new Claim(ClaimTypes.Role, role),
    ], "tests"));
}
