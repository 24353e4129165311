using System.Security.Claims;
using EventReview.Data.Auth;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Auth;

/// <summary>
/// Turns a person the identity provider vouched for into an EventReview account: the first sign-in makes the account
/// (or joins it to an existing account whose e-mail the provider says is verified), and every sign-in sets the role
/// from the person's groups (<see cref="GroupRoleMap"/>). Each of these is written to the sign-in audit.
/// </summary>
public sealed class SingleSignOnAccounts(UserManager<AppUser> users, AccountAdmin admin, AccountAudit audit, IOptions<SignInSettings> options)
{
    /// <summary>The login provider name stored with each account's provider subject (and the scheme's name).</summary>
    public const string Provider = "oidc";

    /// <summary>The account for the provider's person <paramref name="external"/>, its role brought up to date; or a refusal.</summary>
    public async Task<SingleSignOnAdmission> AdmitAsync(ClaimsPrincipal external, string? address)
    {
        var sso = options.Value.SingleSignOn;
        var subject = external.FindFirst("sub")?.Value;
        var email = external.FindFirst("email")?.Value?.Trim();
        var shown = email ?? subject ?? "(unknown)";
        if (string.IsNullOrEmpty(subject))
        {
            await audit.RecordAsync(AccountEventKinds.SignInFailed, null, shown, address, "single sign-on: the provider sent no subject (sub)");
            return SingleSignOnAdmission.Refused("sso-no-subject");
        }

        var groups = external.FindAll(sso.GroupsClaim).Select(c => c.Value).Distinct(StringComparer.Ordinal).ToList();
        var map = sso.Map();
        var role = map.RoleFor(groups);
        var user = await users.FindByLoginAsync(Provider, subject);
        if (role is null)
        {
            await audit.RecordAsync(AccountEventKinds.SignInFailed, user?.Id, shown, address,
                $"single sign-on: none of the groups [{string.Join(", ", groups)}] gives a role");
            return SingleSignOnAdmission.Refused("sso-no-role");
        }

        user ??= await FindOrCreateAsync(external, subject, email, role, groups, map, address);
        if (user is null)
        {
            return SingleSignOnAdmission.Refused(string.IsNullOrEmpty(email) ? "sso-no-email" : "sso-email-taken");
        }

        var current = (await users.GetRolesAsync(user)).FirstOrDefault();
        if (!string.Equals(current, role, StringComparison.Ordinal))
        {
            await admin.SetRoleAsync(user.Id, role, $"{current ?? "(none)"} -> {role}: {Because(role, groups, map)}", address);
        }

        return new SingleSignOnAdmission(user, null);
    }

    private async Task<AppUser?> FindOrCreateAsync(ClaimsPrincipal external, string subject, string? email, string role, IReadOnlyList<string> groups, GroupRoleMap map, string? address)
    {
        if (string.IsNullOrEmpty(email) || !email.Contains('@', StringComparison.Ordinal))
        {
            await audit.RecordAsync(AccountEventKinds.SignInFailed, null, subject, address, "single sign-on: the provider sent no e-mail address (email claim)");
            return null;
        }

        var login = new UserLoginInfo(Provider, subject, options.Value.SingleSignOn.DisplayName);
        var existing = await users.FindByEmailAsync(email);
        if (existing is not null)
        {
            // Joining by e-mail is safe only when the provider vouches for the address; otherwise anyone able to set
            // that address at the provider would take over the account.
            if (!string.Equals(external.FindFirst("email_verified")?.Value, "true", StringComparison.OrdinalIgnoreCase))
            {
                await audit.RecordAsync(AccountEventKinds.SignInFailed, existing.Id, email, address,
                    "single sign-on: an account with this e-mail exists and the provider does not say the address is verified");
                return null;
            }

            Ensure(await users.AddLoginAsync(existing, login), "link the account");
            await audit.RecordAsync(AccountEventKinds.AccountLinked, existing.Id, email, address, $"provider subject {subject}");
            return existing;
        }

        var name = external.FindFirst("name")?.Value ?? external.FindFirst("preferred_username")?.Value;
        var display = string.IsNullOrWhiteSpace(name) ? email.Split('@')[0] : name.Trim();
        var user = await admin.CreateExternalAsync(email, display, login, role, $"first single sign-on; role {role}: {Because(role, groups, map)}", address);
        return user;
    }

    private static string Because(string role, IReadOnlyList<string> groups, GroupRoleMap map)
    {
        var giving = map.GroupsGiving(role, groups);
        return giving.Count > 0 ? $"groups [{string.Join(", ", giving)}]" : "the default role (no mapped group)";
    }

    private static void Ensure(IdentityResult result, string what)
    {
        if (!result.Succeeded)
        {
            throw new InvalidOperationException($"Could not {what}: {string.Join(" ", result.Errors.Select(e => e.Description))}");
        }
    }
}
