using EventReview.Data.Auth;
using Microsoft.AspNetCore.Authorization;

namespace EventReview.Web.Auth;

/// <summary>Authorisation policies, checked on the server for every page and endpoint.</summary>
public static class Policies
{
    /// <summary>Any signed-in user or API token.</summary>
    public const string Read = "read";

    /// <summary>Coordinators and pipelines (API tokens).</summary>
    public const string OpenCases = "open-cases";

    /// <summary>Coordinators, reviewers and pipelines.</summary>
    public const string AddEvidence = "add-evidence";

    /// <summary>Coordinators and reviewers (people only).</summary>
    public const string Work = "work";

    /// <summary>Coordinators only.</summary>
    public const string Coordinate = "coordinate";

    public static void Configure(AuthorizationOptions o)
    {
        o.AddPolicy(Read, p => p.RequireAuthenticatedUser());
        o.AddPolicy(OpenCases, p => p.RequireRole(Roles.Coordinator, Roles.Pipeline));
        o.AddPolicy(AddEvidence, p => p.RequireRole(Roles.Coordinator, Roles.Reviewer, Roles.Pipeline));
        o.AddPolicy(Work, p => p.RequireRole(Roles.Coordinator, Roles.Reviewer));
        o.AddPolicy(Coordinate, p => p.RequireRole(Roles.Coordinator));
        o.FallbackPolicy = new AuthorizationPolicyBuilder().RequireAuthenticatedUser().Build();
    }
}
