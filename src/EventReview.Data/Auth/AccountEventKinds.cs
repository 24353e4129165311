namespace EventReview.Data.Auth;

/// <summary>The kinds of entry in the sign-in audit (<see cref="AccountEvent.Kind"/>).</summary>
public static class AccountEventKinds
{
    public const string SignInSucceeded = "signin.succeeded";
    public const string SignInFailed = "signin.failed";
    public const string LockedOut = "signin.locked-out";
    public const string SignedOut = "signout";
    public const string TokenCreated = "token.created";
    public const string TokenRevoked = "token.revoked";
    public const string AccountCreated = "account.created";
    public const string RoleChanged = "account.role";
    public const string SealRegistered = "seal.registered";
    public const string SealOpened = "seal.opened";

    /// <summary>A short English label for the sign-in activity page.</summary>
    public static string Label(string kind) => kind switch
    {
        SignInSucceeded => "signed in",
        SignInFailed => "sign-in failed",
        LockedOut => "locked out",
        SignedOut => "signed out",
        TokenCreated => "token created",
        TokenRevoked => "token revoked",
        AccountCreated => "account created",
        RoleChanged => "role changed",
        SealRegistered => "sealed record registered",
        SealOpened => "sealed record opened",
        _ => kind,
    };
}
