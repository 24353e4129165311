namespace EventReview.Web.Security;

/// <summary>
/// Request limits, configuration section <c>EventReview:RateLimits</c>. Defaults let one pipeline token send about
/// 150 requests a second (bursts up to 300) while stopping password guessing from one address.
/// </summary>
public sealed class RateLimitSettings
{
    public const string Section = "EventReview:RateLimits";

    /// <summary>False turns every limit off (not for a server on a network).</summary>
    public bool Enabled { get; set; } = true;

    /// <summary>Sign-in form posts allowed per client address per minute (default 10).</summary>
    public int SignInPerMinute { get; set; } = 10;

    /// <summary>Sustained API requests per second allowed for one API token (default 150).</summary>
    public int TokenPerSecond { get; set; } = 150;

    /// <summary>Requests one API token may send at once before the sustained rate applies (default 300).</summary>
    public int TokenBurst { get; set; } = 300;

    /// <summary>
    /// API and download requests per minute per client address for requests without a valid token: people's browsers and
    /// anonymous or refused callers (default 1200). Raise it for a load run from one machine without tokens.
    /// </summary>
    public int AddressPerMinute { get; set; } = 1200;
}
