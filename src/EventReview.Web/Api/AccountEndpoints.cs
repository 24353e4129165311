using System.Security.Claims;
using EventReview.Data.Auth;
using EventReview.Web.Security;
using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Identity;
using Microsoft.AspNetCore.Mvc;

namespace EventReview.Web.Api;

/// <summary>
/// Form posts for signing in and out (cookies can only be set on a plain HTTP request, not in a circuit). Both need the
/// antiforgery token from the page that holds the form; both are written to the sign-in audit.
/// </summary>
public static class AccountEndpoints
{
    /// <summary>Longest email accepted on the sign-in form (RFC 5321 path limit), characters.</summary>
    public const int MaxEmailLength = 254;

    /// <summary>Longest password accepted on the sign-in form, characters.</summary>
    public const int MaxPasswordLength = 1024;

    public static IEndpointRouteBuilder MapAccountEndpoints(this IEndpointRouteBuilder app)
    {
        // [FromForm] parameters make the framework validate the antiforgery token before this body runs (400 otherwise).
        app.MapPost("/account/signin", async ([FromForm] string? email, [FromForm] string? password, [FromForm] string? returnUrl,
            SignInManager<AppUser> signIn, AccountAudit audit, HttpContext http, Microsoft.Extensions.Options.IOptions<Auth.SignInSettings> ways) =>
        {
            var back = ReturnUrls.Safe(returnUrl);
            if (!ways.Value.LocalAccounts)
            {
                await audit.RecordAsync(AccountEventKinds.SignInFailed, null, email?.Trim(), ClientAddress.Of(http), "local accounts are switched off");
                return Results.Redirect($"/signin?error=local-off&returnUrl={Uri.EscapeDataString(back)}");
            }

            if (string.IsNullOrWhiteSpace(email) || string.IsNullOrEmpty(password))
            {
                return Results.Redirect($"/signin?error=missing&returnUrl={Uri.EscapeDataString(back)}");
            }

            // An email longer than any address, or a password longer than any real one, is refused before hashing it.
            if (email.Length > MaxEmailLength || password.Length > MaxPasswordLength)
            {
                return Results.Redirect($"/signin?error=too-long&returnUrl={Uri.EscapeDataString(back)}");
            }

            var address = ClientAddress.Of(http);
            var typed = email.Trim();
            var user = await signIn.UserManager.FindByEmailAsync(typed);
            var result = await signIn.PasswordSignInAsync(typed, password, isPersistent: false, lockoutOnFailure: true);
            if (result.Succeeded)
            {
                await audit.RecordAsync(AccountEventKinds.SignInSucceeded, user?.Id, typed, address);
                return Results.LocalRedirect(back);
            }

            // The same "invalid" answer whether or not the email exists; "locked" only for an existing, locked account.
            var locked = result.IsLockedOut;
            await audit.RecordAsync(locked ? AccountEventKinds.LockedOut : AccountEventKinds.SignInFailed, user?.Id, typed, address,
                locked ? "account locked after repeated failures" : null);
            return Results.Redirect($"/signin?error={(locked ? "locked" : "invalid")}&returnUrl={Uri.EscapeDataString(back)}");
        }).AllowAnonymous().RequireRateLimiting(SignInRateLimitPolicy.Name).ExcludeFromDescription(); // the browser's sign-in form, not for clients

        // No form fields are bound here, so the antiforgery token is checked explicitly.
        app.MapPost("/account/signout", async (SignInManager<AppUser> signIn, IAntiforgery antiforgery, AccountAudit audit, HttpContext http, ClaimsPrincipal user) =>
        {
            if (!await antiforgery.IsRequestValidAsync(http))
            {
                return Results.Problem(statusCode: StatusCodes.Status400BadRequest, title: "Sign-out refused",
                    detail: "The sign-out form had no valid antiforgery token; use the Sign out button in the app.");
            }

            await audit.RecordAsync(AccountEventKinds.SignedOut, user.FindFirstValue(ClaimTypes.NameIdentifier), user.Identity?.Name, ClientAddress.Of(http));
            await signIn.SignOutAsync();
            return Results.Redirect("/signin");
        }).ExcludeFromDescription();
        return app;
    }
}
