using System.Security.Claims;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Security;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Api;

/// <summary>
/// Single sign-on at the identity provider: <c>/account/sso</c> sends the browser there and <c>/account/sso/done</c>
/// signs the person in on the way back; <c>/account/sso/sign/{id}</c> and <c>.../done</c> do the same for signing a
/// review item, with a fresh sign-in at the provider (see <see cref="ReauthenticatedSigning"/>). Mapped only when single
/// sign-on is set up.
/// </summary>
public static class SingleSignOnEndpoints
{
    public static IEndpointRouteBuilder MapSingleSignOnEndpoints(this IEndpointRouteBuilder app)
    {
        if (!app.ServiceProvider.GetRequiredService<IOptions<SignInSettings>>().Value.SingleSignOn.Enabled)
        {
            return app;
        }

        app.MapGet("/account/sso", async (string? returnUrl, HttpContext http) =>
        {
            var back = ReturnUrls.Safe(returnUrl);
            if (!await SingleSignOnSetup.ProviderAnswersAsync(http))
            {
                return Results.Redirect($"/signin?error=sso-unavailable&returnUrl={Uri.EscapeDataString(back)}");
            }

            var properties = new AuthenticationProperties { RedirectUri = $"/account/sso/done?returnUrl={Uri.EscapeDataString(back)}" };
            properties.Items[SingleSignOnSetup.PurposeKey] = SingleSignOnSetup.ForSignIn;
            return Results.Challenge(properties, [SingleSignOnAccounts.Provider]);
        }).AllowAnonymous().ExcludeFromDescription();

        app.MapGet("/account/sso/done", async (string? returnUrl, HttpContext http, SingleSignOnAccounts accounts, SignInManager<AppUser> signIn, AccountAudit audit) =>
        {
            var back = ReturnUrls.Safe(returnUrl);
            var external = await http.AuthenticateAsync(IdentityConstants.ExternalScheme);
            await http.SignOutAsync(IdentityConstants.ExternalScheme);
            if (!external.Succeeded || external.Principal is null)
            {
                return Results.Redirect($"/signin?error=sso-failed&returnUrl={Uri.EscapeDataString(back)}");
            }

            var address = ClientAddress.Of(http);
            var admission = await accounts.AdmitAsync(external.Principal, address);
            if (admission.User is not { } user)
            {
                return Results.Redirect($"/signin?error={admission.Refusal}&returnUrl={Uri.EscapeDataString(back)}");
            }

            await signIn.SignInWithClaimsAsync(user, isPersistent: false, [new Claim(SingleSignOnSetup.SignedInWithClaim, SingleSignOnSetup.SingleSignOnValue)]);
            await audit.RecordAsync(AccountEventKinds.SignInSucceeded, user.Id, user.Email, address, "single sign-on");
            return Results.LocalRedirect(back);
        }).AllowAnonymous().ExcludeFromDescription();

        app.MapGet("/account/sso/sign/{id}", async (string id, HttpContext http, ClaimsPrincipal user, ReauthenticatedSigning signing) =>
        {
            var request = await signing.FindAsync(user, id, http.RequestAborted);
            if (request is null)
            {
                return Results.Redirect("/cases");
            }

            var back = ItemPath(request);
            if (request.UsedAt is not null)
            {
                return Results.LocalRedirect(back);
            }

            if (!await SingleSignOnSetup.ProviderAnswersAsync(http))
            {
                await signing.CompleteAsync(user, id, null, "The identity provider did not answer, so you could not sign in again there. Nothing was signed; try again in a few minutes.",
                    ClientAddress.Of(http), http.RequestAborted);
                return Results.LocalRedirect(back);
            }

            var properties = new AuthenticationProperties { RedirectUri = $"/account/sso/sign/{id}/done" };
            properties.Items[SingleSignOnSetup.PurposeKey] = SingleSignOnSetup.ForSignature;
            properties.Items[SingleSignOnSetup.SignatureRequestKey] = id;
            properties.Items[SingleSignOnSetup.LoginHintKey] = user.FindFirstValue(ClaimTypes.Email) ?? user.Identity?.Name;
            return Results.Challenge(properties, [SingleSignOnAccounts.Provider]);
        }).RequireAuthorization(Policies.Work).ExcludeFromDescription();

        app.MapGet("/account/sso/sign/{id}/done", async (string id, string? failed, HttpContext http, ClaimsPrincipal user, ReauthenticatedSigning signing) =>
        {
            var external = await http.AuthenticateAsync(IdentityConstants.ExternalScheme);
            await http.SignOutAsync(IdentityConstants.ExternalScheme);
            var failure = failed is null ? null : "Signing in again at the identity provider did not complete (cancelled or refused there). Nothing was signed.";
            var request = await signing.CompleteAsync(user, id, external.Succeeded ? external.Principal : null, failure, ClientAddress.Of(http), http.RequestAborted);
            return request is null ? Results.Redirect("/cases") : Results.LocalRedirect(ItemPath(request));
        }).RequireAuthorization(Policies.Work).ExcludeFromDescription();
        return app;
    }

    private static string ItemPath(SignatureRequest request) =>
        $"/cases/{request.CaseId}/items/{Uri.EscapeDataString(request.ItemKey)}?signature={request.Id}";
}
