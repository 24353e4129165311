using EventReview.Data.Auth;

namespace EventReview.Web.Auth;

/// <summary>
/// Which role a person's identity-provider groups give: the highest role any of their groups maps to (coordinator
/// above reviewer above observer), else the default role, else none. Group names compare exactly (case matters, as
/// at most providers).
/// </summary>
public sealed class GroupRoleMap(IReadOnlyDictionary<string, IReadOnlyList<string>> groupsByRole, string? defaultRole)
{
    /// <summary>The role for these groups, or null when none maps and there is no default.</summary>
    public string? RoleFor(IEnumerable<string> groups)
    {
        var set = groups.ToHashSet(StringComparer.Ordinal);
        foreach (var role in Roles.All)
        {
            if (groupsByRole.TryGetValue(role, out var mapped) && mapped.Any(set.Contains))
            {
                return role;
            }
        }

        return defaultRole;
    }

    /// <summary>The groups that gave <paramref name="role"/> (for the audit entry), or empty when it came from the default.</summary>
    public IReadOnlyList<string> GroupsGiving(string role, IEnumerable<string> groups) =>
        groupsByRole.TryGetValue(role, out var mapped) ? groups.Where(mapped.Contains).ToList() : [];
}
