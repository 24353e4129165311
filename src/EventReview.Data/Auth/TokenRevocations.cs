namespace EventReview.Data.Auth;

/// <summary>
/// Counts the token revocations made in this process, so that whatever remembers checked tokens (the web app's token
/// cache) can tell that its entries may be out of date and read them again.
/// </summary>
public sealed class TokenRevocations
{
    private long _generation;

    /// <summary>Changes after every revocation in this process.</summary>
    public long Generation => Interlocked.Read(ref _generation);

    /// <summary>Called after a token was revoked.</summary>
    public void Revoked() => Interlocked.Increment(ref _generation);
}
