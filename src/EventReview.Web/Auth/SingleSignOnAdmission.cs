namespace EventReview.Web.Auth;

/// <summary>
/// The answer to a single sign-on: the account to sign in, or a refusal code for the sign-in page
/// (<c>sso-no-role</c>, <c>sso-no-email</c>, <c>sso-email-taken</c>, <c>sso-no-subject</c>).
/// </summary>
public sealed record SingleSignOnAdmission(EventReview.Data.Auth.AppUser? User, string? Refusal)
{
    public static SingleSignOnAdmission Refused(string code) => new(null, code);
}
