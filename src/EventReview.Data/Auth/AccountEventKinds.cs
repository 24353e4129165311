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
    public const string SealRegistered = "seal.registered";
    public const string SealOpened = "seal.opened";

    /// <summary>An account was made: by a coordinator, by the demo, or at a person's first single sign-on.</summary>
    public const string AccountCreated = "account.created";

    /// <summary>A single sign-on identity was joined to an existing account with the same, provider-verified e-mail.</summary>
    public const string AccountLinked = "account.linked";

    /// <summary>A role changed: set by a coordinator, or because the person's groups at the identity provider changed.</summary>
    public const string RoleChanged = "account.role";

    /// <summary>A signer re-authenticated at the identity provider to sign a review item.</summary>
    public const string SignatureReauthenticated = "signature.reauthenticated";

    /// <summary>A signature was refused because re-authentication did not prove the signer (stale, another person, failed).</summary>
    public const string SignatureRefused = "signature.refused";

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
        AccountLinked => "account linked",
        RoleChanged => "role changed",
        SignatureReauthenticated => "re-authenticated to sign",
        SignatureRefused => "signature refused",
        SealRegistered => "sealed record registered",
        SealOpened => "sealed record opened",
        _ => kind,
    };
}
