using Microsoft.AspNetCore.Authorization;

namespace EventReview.Web.Auth;

/// <summary>Authorisation policies, checked on the server for every page and endpoint.</summary>
public static class Policies
{
    /// <summary>Any signed-in person (no API token): every page, and the default for [Authorize] without a policy.</summary>
    public const string Person = "person";

    /// <summary>Any signed-in person, or an API token with the cases:read scope.</summary>
    public const string Read = "read";

    /// <summary>Coordinators, or an API token with the cases:open scope.</summary>
    public const string OpenCases = "open-cases";

    /// <summary>Coordinators, reviewers, or an API token with the evidence:add scope.</summary>
    public const string AddEvidence = "add-evidence";

    /// <summary>Coordinators and reviewers (people only).</summary>
    public const string Work = "work";

    /// <summary>Coordinators only.</summary>
    public const string Coordinate = "coordinate";

    /// <summary>Every policy is the same rule as <see cref="Services.Permissions.Allows"/>, so pages, endpoints and services agree.</summary>
    public static void Configure(AuthorizationOptions o)
    {
        foreach (var name in (string[])[Person, Read, OpenCases, AddEvidence, Work, Coordinate])
        {
            o.AddPolicy(name, Build(name));
        }

        // Pages and anything without its own policy are for people only: a token never gets more than its scopes.
        o.DefaultPolicy = Build(Person);
        o.FallbackPolicy = Build(Person);
    }

    private static AuthorizationPolicy Build(string name) => new AuthorizationPolicyBuilder()
        .RequireAuthenticatedUser()
        .RequireAssertion(ctx => Services.Permissions.Allows(ctx.User, name))
        .Build();
}
