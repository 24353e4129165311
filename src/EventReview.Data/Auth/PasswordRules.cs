using System.Reflection;
using Microsoft.AspNetCore.Identity;

namespace EventReview.Data.Auth;

/// <summary>
/// Password rules beyond Identity's own (length and character classes, set in
/// <see cref="DataServiceCollectionExtensions.ConfigureIdentity"/>): a password must not be the account's email, the
/// part of it before '@', or its display name, and must not be on the bundled list of very common passwords.
/// Registered for the web app and the CLI alike, so every way of setting a password obeys it.
/// </summary>
public sealed class PasswordRules : IPasswordValidator<AppUser>
{
    private static readonly Lazy<HashSet<string>> Common = new(LoadCommon);

    public Task<IdentityResult> ValidateAsync(UserManager<AppUser> manager, AppUser user, string? password)
    {
        var p = (password ?? string.Empty).Trim();
        var errors = new List<IdentityError>();
        string?[] personal = [user.Email, user.UserName, user.Email?.Split('@')[0], user.DisplayName];
        if (personal.Any(x => !string.IsNullOrWhiteSpace(x) && string.Equals(x.Trim(), p, StringComparison.OrdinalIgnoreCase)))
        {
            errors.Add(new IdentityError { Code = "PasswordIsPersonal", Description = "The password must not be the email address or the name of the account." });
        }

        if (IsCommon(p))
        {
            errors.Add(new IdentityError { Code = "PasswordIsCommon", Description = "This password is on the list of very common passwords; choose a less guessable one." });
        }

        return Task.FromResult(errors.Count == 0 ? IdentityResult.Success : IdentityResult.Failed([.. errors]));
    }

    /// <summary>True when the password (ignoring case) is on the bundled common-password list.</summary>
    public static bool IsCommon(string password) => Common.Value.Contains(password.Trim());

    private static HashSet<string> LoadCommon()
    {
        using var stream = Assembly.GetExecutingAssembly().GetManifestResourceStream("EventReview.Data.Auth.common-passwords.txt")
            ?? throw new InvalidOperationException("The common-password list is missing from the assembly.");
        using var reader = new StreamReader(stream);
        var set = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        while (reader.ReadLine() is { } line)
        {
            line = line.Trim();
            if (line.Length > 0 && !line.StartsWith('#'))
            {
                set.Add(line);
            }
        }

        return set;
    }
}
