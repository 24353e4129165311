using EventReview.Data.Auth;
using Microsoft.AspNetCore.Identity;
using Microsoft.AspNetCore.Mvc;

namespace EventReview.Web.Api;

/// <summary>Form posts for signing in and out (cookies can only be set on a plain HTTP request, not in a circuit).</summary>
public static class AccountEndpoints
{
    public static IEndpointRouteBuilder MapAccountEndpoints(this IEndpointRouteBuilder app)
    {
        app.MapPost("/account/signin", async ([FromForm] string? email, [FromForm] string? password, [FromForm] string? returnUrl, SignInManager<AppUser> signIn) =>
        {
            var back = SafeReturn(returnUrl);
            if (string.IsNullOrWhiteSpace(email) || string.IsNullOrEmpty(password))
            {
                return Results.Redirect($"/signin?error=missing&returnUrl={Uri.EscapeDataString(back)}");
            }

            var result = await signIn.PasswordSignInAsync(email.Trim(), password, isPersistent: false, lockoutOnFailure: true);
            if (result.Succeeded)
            {
                return Results.LocalRedirect(back);
            }

            var error = result.IsLockedOut ? "locked" : "invalid";
            return Results.Redirect($"/signin?error={error}&returnUrl={Uri.EscapeDataString(back)}");
        }).AllowAnonymous();

        app.MapPost("/account/signout", async (SignInManager<AppUser> signIn) =>
        {
            await signIn.SignOutAsync();
            return Results.Redirect("/signin");
        });
        return app;
    }

    private static string SafeReturn(string? url) =>
        !string.IsNullOrEmpty(url) && url.StartsWith('/') && !url.StartsWith("//", StringComparison.Ordinal) && !url.StartsWith("/\\", StringComparison.Ordinal) ? url : "/cases";
}
