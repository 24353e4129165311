namespace EventReview.Web.Auth;

/// <summary>Settings under <c>EventReview:SignIn</c>: which ways in are open.</summary>
public sealed class SignInSettings
{
    public const string Section = "EventReview:SignIn";

    /// <summary>
    /// Accounts with an e-mail and a password kept here (made on the Team page or with <c>eventreview users add</c>).
    /// Default on. Switched off, the password form disappears, password sign-ins are refused and sessions that began
    /// with a password end at their next request; single sign-on must then be set up.
    /// </summary>
    public bool LocalAccounts { get; set; } = true;

    /// <summary>Single sign-on at the collaboration's OpenID Connect provider; off while its authority is empty.</summary>
    public SingleSignOnSettings SingleSignOn { get; set; } = new();

    /// <summary>Every setting that stops the app from starting, as sentences naming the setting; empty when all is well.</summary>
    public IReadOnlyList<string> Problems()
    {
        var problems = new List<string>(SingleSignOn.Problems());
        if (!LocalAccounts && !SingleSignOn.Enabled)
        {
            problems.Add($"{Section}:LocalAccounts is false but {SingleSignOnSettings.Section}:Authority is empty: nobody could sign in. Set up single sign-on or leave local accounts on.");
        }

        return problems;
    }
}
