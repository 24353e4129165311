using System.Security.Claims;
using EventReview.Data.Auth;
using EventReview.Web.Auth;

namespace EventReview.Web.Services;

/// <summary>Server-side role checks for service operations (the UI hides what a role cannot do, but never relies on it).</summary>
public static class Permissions
{
    public static bool Allows(ClaimsPrincipal user, string policy) => policy switch
    {
        Policies.Read => user.Identity?.IsAuthenticated == true,
        Policies.OpenCases => user.IsInRole(Roles.Coordinator) || user.IsInRole(Roles.Pipeline),
        Policies.AddEvidence => user.IsInRole(Roles.Coordinator) || user.IsInRole(Roles.Reviewer) || user.IsInRole(Roles.Pipeline),
        Policies.Work => user.IsInRole(Roles.Coordinator) || user.IsInRole(Roles.Reviewer),
        Policies.Coordinate => user.IsInRole(Roles.Coordinator),
        _ => false,
    };

    /// <exception cref="UnauthorizedAccessException">When the user's role does not allow the action.</exception>
    public static void Require(ClaimsPrincipal user, string policy, string action)
    {
        if (!Allows(user, policy))
        {
            throw new UnauthorizedAccessException($"Your role does not allow you to {action}.");
        }
    }
}
