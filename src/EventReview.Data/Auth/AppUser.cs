using Microsoft.AspNetCore.Identity;

namespace EventReview.Data.Auth;

/// <summary>A local account. <see cref="DisplayName"/> is the printed name used on sign-offs.</summary>
public sealed class AppUser : IdentityUser
{
    public string DisplayName { get; set; } = string.Empty;
}
