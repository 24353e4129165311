using System.Security.Claims;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Demo;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>
/// The password proof a test shows when it signs through <see cref="Services.CaseWorkflow.SignAsync"/>, which checks the
/// signer's re-authentication itself: a demo account signs with its demo password; any other principal made by
/// <see cref="Principals"/> gets a local account with <see cref="Password"/> the first time it signs.
/// </summary>
public static class Signers
{
    /// <summary>The password of the accounts made here.</summary>
    public const string Password = "Signer-test-pass-4821!";

    /// <summary>A proof the workflow accepts for <paramref name="signer"/> (making its account when there is none).</summary>
    public static async Task<SignatureProof> ProofAsync(IServiceProvider services, ClaimsPrincipal signer)
    {
        using var scope = services.CreateScope();
        var users = scope.ServiceProvider.GetRequiredService<UserManager<AppUser>>();
        var id = signer.FindFirstValue(ClaimTypes.NameIdentifier) ?? throw new ArgumentException("The principal has no account id.", nameof(signer));
        var account = await users.FindByIdAsync(id);
        if (account is not null)
        {
            var demo = DemoAccounts.All.FirstOrDefault(a => a.Email == account.Email);
            return new SignatureProof.Password(demo?.Password ?? Password);
        }

        var email = $"{id}@signers.test.invalid";
        var made = await users.CreateAsync(new AppUser { Id = id, UserName = email, Email = email, DisplayName = signer.FindFirstValue(UserClaims.DisplayName) ?? id }, Password);
        if (!made.Succeeded)
        {
            throw new InvalidOperationException("The signer's account could not be made: " + string.Join("; ", made.Errors.Select(e => e.Description)));
        }

        return new SignatureProof.Password(Password);
    }
}
