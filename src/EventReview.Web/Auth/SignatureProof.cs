namespace EventReview.Web.Auth;

/// <summary>
/// What a signer shows, at the moment of signing, to prove they are the person signed in: their password (local
/// accounts) or a fresh sign-in at the identity provider (single sign-on). <see cref="SignerCheck"/> judges it; the
/// case workflow refuses a sign-off without a proof it accepts.
/// </summary>
public abstract record SignatureProof
{
    private SignatureProof()
    {
    }

    /// <summary>The signer's password, re-entered to sign (local accounts).</summary>
    /// <param name="Secret">The password as typed; never stored or logged.</param>
    public sealed record Password(string Secret) : SignatureProof
    {
        /// <inheritdoc />
        public override string ToString() => "Password { Secret = *** }";
    }

    /// <summary>
    /// The identity provider's answer to a sign-in asked for this signature (<c>prompt=login</c>, <c>max_age=0</c>).
    /// </summary>
    /// <param name="Subject">The provider's <c>sub</c> claim of the fresh answer, or null when it named none.</param>
    /// <param name="AuthTime">The provider's <c>auth_time</c> of the fresh answer, or null when it gave none.</param>
    /// <param name="RequestedAt">When the signer asked to sign (the fresh sign-in must come after it).</param>
    public sealed record ProviderSignIn(string? Subject, DateTimeOffset? AuthTime, DateTimeOffset RequestedAt) : SignatureProof;
}
