using System.Security.Claims;
using EventReview.Data.Auth;
using EventReview.Web.Auth;

namespace EventReview.Web.Demo;

/// <summary>The invented demo accounts (shown on the sign-in page in demo mode only).</summary>
public static class DemoAccounts
{
    public sealed record Account(string Email, string Password, string Role, string DisplayName);

    public static IReadOnlyList<Account> All { get; } =
    [
        new("coordinator@demo.invalid", "DemoCoordinator1", Roles.Coordinator, "Demo Coordinator"),
        new("reviewer.a@demo.invalid", "DemoReviewerA1", Roles.Reviewer, "Demo Reviewer A"),
        new("reviewer.b@demo.invalid", "DemoReviewerB1", Roles.Reviewer, "Demo Reviewer B"),
        new("observer@demo.invalid", "DemoObserver1", Roles.Observer, "Demo Observer"),
    ];

    /// <summary>
    /// The demo seed signs as the demo people with their own passwords, as a person at the sign-off form would: the
    /// workflow checks every signer's re-authentication, the seed's too.
    /// </summary>
    public static SignatureProof Proof(ClaimsPrincipal signer) =>
        new SignatureProof.Password(All.First(a => a.Email == signer.Identity?.Name).Password);
}
