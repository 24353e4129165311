using System.Security.Claims;
using EventReview.Data.Auth;
using EventReview.Web.Auth;

namespace EventReview.Web.Services;

/// <summary>
/// Server-side checks for service operations and endpoints (the UI hides what a role cannot do, but never relies on it).
/// People are checked by role; API tokens only by scope (a token has no role, so it can never work, sign or coordinate).
/// </summary>
public static class Permissions
{
    public static bool Allows(ClaimsPrincipal user, string policy) => policy switch
    {
        Policies.Person => user.IsPerson(),
        Policies.Read => user.IsPerson() || user.HasScope(TokenScopes.CasesRead),
        Policies.OpenCases => (user.IsPerson() && user.IsInRole(Roles.Coordinator)) || user.HasScope(TokenScopes.CasesOpen),
        Policies.AddEvidence => (user.IsPerson() && (user.IsInRole(Roles.Coordinator) || user.IsInRole(Roles.Reviewer))) || user.HasScope(TokenScopes.EvidenceAdd),
        Policies.Work => user.IsPerson() && (user.IsInRole(Roles.Coordinator) || user.IsInRole(Roles.Reviewer)),
        Policies.Coordinate => user.IsPerson() && user.IsInRole(Roles.Coordinator),
        _ => false,
    };

    /// <exception cref="UnauthorizedAccessException">When the user's role does not allow the action.</exception>
    public static void Require(ClaimsPrincipal user, string policy, string action)
    {
        if (!Allows(user, policy))
        {
            throw new UnauthorizedAccessException(user.IsPerson() ? $"Your role does not allow you to {action}." : $"This API token's scopes do not allow it to {action}.");
        }
    }
}
