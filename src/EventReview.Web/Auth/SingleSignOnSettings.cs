using EventReview.Data.Auth;

namespace EventReview.Web.Auth;

/// <summary>
/// Settings under <c>EventReview:SignIn:SingleSignOn</c>: the collaboration's OpenID Connect provider (authorization
/// code flow with PKCE) and how its groups give EventReview roles. See docs/operations.md "Single sign-on".
/// </summary>
public sealed class SingleSignOnSettings
{
    public const string Section = SignInSettings.Section + ":SingleSignOn";

    /// <summary>The provider's issuer address (its discovery document is at <c>.well-known/openid-configuration</c> below it). Empty: single sign-on is off.</summary>
    public string? Authority { get; set; }

    /// <summary>This app's client id at the provider.</summary>
    public string? ClientId { get; set; }

    /// <summary>This app's client secret at the provider (keep it in the environment file, not in appsettings.json).</summary>
    public string? ClientSecret { get; set; }

    /// <summary>What the sign-in button calls the provider (default "the collaboration's sign-in").</summary>
    public string DisplayName { get; set; } = "the collaboration's sign-in";

    /// <summary>The ID-token claim that lists the person's groups (default <c>groups</c>).</summary>
    public string GroupsClaim { get; set; } = "groups";

    /// <summary>
    /// Role to groups: keys are the roles (<c>coordinator</c>, <c>reviewer</c>, <c>observer</c>), values one or more
    /// group names separated by commas, e.g. <c>RoleMap:coordinator = gw-review-coordinators</c>. A person in several
    /// mapped groups gets the highest role (coordinator, then reviewer, then observer).
    /// </summary>
    public Dictionary<string, string> RoleMap { get; set; } = new(StringComparer.OrdinalIgnoreCase);

    /// <summary>Role for a person in none of the mapped groups; empty (the default) refuses them.</summary>
    public string? DefaultRole { get; set; }

    /// <summary>Extra scopes to ask for besides <c>openid profile email</c> (space-separated), e.g. <c>groups</c>.</summary>
    public string? Scopes { get; set; }

    /// <summary>Require https for the authority (default true; false only for a provider on this machine or in tests).</summary>
    public bool RequireHttps { get; set; } = true;

    /// <summary>
    /// How old the provider's <c>auth_time</c> may be when a person signs a review item (seconds, default 300). Signing
    /// asks the provider to authenticate again (<c>prompt=login</c>, <c>max_age=0</c>); a provider that answers with an
    /// older sign-in, or none, is refused.
    /// </summary>
    public int SignatureMaxAgeSeconds { get; set; } = 300;

    /// <summary>True when an authority is set.</summary>
    public bool Enabled => !string.IsNullOrWhiteSpace(Authority);

    /// <summary>The parsed role map (role to its groups); call <see cref="Problems"/> first.</summary>
    public GroupRoleMap Map() => new(RoleMap.ToDictionary(
        p => p.Key.Trim().ToLowerInvariant(),
        p => (IReadOnlyList<string>)p.Value.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)),
        string.IsNullOrWhiteSpace(DefaultRole) ? null : DefaultRole.Trim().ToLowerInvariant());

    /// <summary>Sentences naming each setting that is wrong; empty when single sign-on is off or set up correctly.</summary>
    public IReadOnlyList<string> Problems()
    {
        var problems = new List<string>();
        if (!Enabled)
        {
            if (!string.IsNullOrWhiteSpace(ClientId) || !string.IsNullOrWhiteSpace(ClientSecret) || RoleMap.Count > 0)
            {
                problems.Add($"{Section}:Authority is empty but other single sign-on settings are set: give the provider's issuer address (e.g. https://login.example.org/realms/collab), or remove the others.");
            }

            return problems;
        }

        if (!Uri.TryCreate(Authority!.Trim(), UriKind.Absolute, out var authority) || authority.Scheme is not ("https" or "http"))
        {
            problems.Add($"{Section}:Authority '{Authority}' is not an absolute http(s) address; give the provider's issuer, e.g. https://login.example.org/realms/collab.");
        }
        else if (RequireHttps && authority.Scheme != "https")
        {
            problems.Add($"{Section}:Authority '{Authority}' is not https; sign-in tokens must not travel in clear. Use the provider's https address (RequireHttps=false is for a provider on this machine only).");
        }

        if (string.IsNullOrWhiteSpace(ClientId))
        {
            problems.Add($"{Section}:ClientId is empty; give the client id this app was registered with at the provider.");
        }

        if (string.IsNullOrWhiteSpace(ClientSecret))
        {
            problems.Add($"{Section}:ClientSecret is empty; give the client secret the provider issued for this app (in the environment file, e.g. EventReview__SignIn__SingleSignOn__ClientSecret).");
        }

        if (string.IsNullOrWhiteSpace(GroupsClaim))
        {
            problems.Add($"{Section}:GroupsClaim is empty; name the ID-token claim that lists groups (usually 'groups').");
        }

        foreach (var (role, groups) in RoleMap)
        {
            if (!Roles.IsKnown(role.Trim().ToLowerInvariant()))
            {
                problems.Add($"{Section}:RoleMap:{role} is not a role; the keys of RoleMap are the roles {string.Join(", ", Roles.All)} and the values their groups.");
            }
            else if (string.IsNullOrWhiteSpace(groups))
            {
                problems.Add($"{Section}:RoleMap:{role} names no group.");
            }
        }

        if (!string.IsNullOrWhiteSpace(DefaultRole) && !Roles.IsKnown(DefaultRole.Trim().ToLowerInvariant()))
        {
            problems.Add($"{Section}:DefaultRole '{DefaultRole}' is not a role; use one of {string.Join(", ", Roles.All)}, or leave it empty to refuse people in no mapped group.");
        }

        if (RoleMap.Count == 0 && string.IsNullOrWhiteSpace(DefaultRole))
        {
            problems.Add($"{Section}:RoleMap is empty and there is no DefaultRole: nobody could get a role. Map at least one group, e.g. {Section}:RoleMap:coordinator = gw-review-coordinators.");
        }

        if (SignatureMaxAgeSeconds is < 10 or > 3600)
        {
            problems.Add($"{Section}:SignatureMaxAgeSeconds {SignatureMaxAgeSeconds} is outside 10 to 3600 seconds.");
        }

        return problems;
    }
}
