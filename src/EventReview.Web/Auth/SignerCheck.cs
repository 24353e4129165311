using System.Security.Claims;
using EventReview.Data.Auth;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Auth;

/// <summary>
/// Judges a <see cref="SignatureProof"/>: a password must be the signer's own; a provider sign-in must name the signer's
/// linked single sign-on account and be fresh (<see cref="SignatureRequest.FreshnessProblem"/>, at most
/// <see cref="SingleSignOnSettings.SignatureMaxAgeSeconds"/> old). Used by the case workflow before any sign-off.
/// </summary>
public sealed class SignerCheck(UserManager<AppUser> users, TimeProvider clock, IOptions<SignInSettings> options)
{
    /// <summary>The message for a wrong or missing password.</summary>
    public const string WrongPassword = "The password is not correct; nothing was signed. Re-enter your own password to sign.";

    /// <summary>Why <paramref name="proof"/> does not prove that <paramref name="user"/> is signing now, or null when it does.</summary>
    public async Task<string?> ProblemAsync(ClaimsPrincipal user, SignatureProof? proof)
    {
        var id = user.FindFirstValue(ClaimTypes.NameIdentifier);
        var account = id is null ? null : await users.FindByIdAsync(id);
        switch (proof)
        {
            case SignatureProof.Password p:
                return account is not null && !string.IsNullOrEmpty(p.Secret) && await users.CheckPasswordAsync(account, p.Secret) ? null : WrongPassword;
            case SignatureProof.ProviderSignIn sso:
                var logins = account is null ? [] : await users.GetLoginsAsync(account);
                if (sso.Subject is null || !logins.Any(l => l.LoginProvider == SingleSignOnAccounts.Provider && l.ProviderKey == sso.Subject))
                {
                    return "The identity provider signed in a different person than the one signing here. Nothing was signed.";
                }

                return SignatureRequest.FreshnessProblem(sso.AuthTime, sso.RequestedAt, clock.GetUtcNow(),
                    TimeSpan.FromSeconds(options.Value.SingleSignOn.SignatureMaxAgeSeconds));
            default:
                return "A sign-off needs the signer to prove who they are now (password or a fresh sign-in at the identity provider). Nothing was signed.";
        }
    }
}
