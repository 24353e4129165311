namespace EventReview.Web.Notifications;

/// <summary>Rules for the webhook addresses people give in their profile (<c>EventReview:Notifications:Webhooks</c>).</summary>
public sealed class WebhookOptions
{
    /// <summary>Allow webhooks at all (default true).</summary>
    public bool Enabled { get; set; } = true;

    /// <summary>Only https addresses (default true): notification texts name cases and people.</summary>
    public bool RequireHttps { get; set; } = true;

    /// <summary>
    /// Allow addresses on this machine or the private network (loopback, RFC 1918, link-local, ...). Default false, so
    /// that a profile cannot make the server call its own neighbours.
    /// </summary>
    public bool AllowPrivateAddresses { get; set; }

    /// <summary>Seconds to wait for the receiver (default 10).</summary>
    public int TimeoutSeconds { get; set; } = 10;
}
