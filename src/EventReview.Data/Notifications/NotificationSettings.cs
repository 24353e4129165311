using System.Security.Cryptography;
using EventReview.Core.Notifications;

namespace EventReview.Data.Notifications;

/// <summary>
/// What one person wants to be told and how (their profile page). A person without a row gets <see cref="Defaults"/>:
/// every event, by e-mail, at once.
/// </summary>
public sealed class NotificationSettings
{
    /// <summary>Longest webhook address kept (characters).</summary>
    public const int MaxUrlLength = 500;

    private NotificationSettings()
    {
        UserId = string.Empty;
    }

    /// <summary>The account (Identity user id).</summary>
    public string UserId { get; private set; }

    /// <summary>The events chosen.</summary>
    public NotificationEvents Events { get; private set; }

    /// <summary>Send e-mail to the account's address.</summary>
    public bool ByEmail { get; private set; }

    /// <summary>Where to POST signed JSON, or null for no webhook.</summary>
    public string? WebhookUrl { get; private set; }

    /// <summary>The key of the webhook's HMAC signature (kept as given to the person, who needs it to verify).</summary>
    public string? WebhookSecret { get; private set; }

    /// <summary>Hold notifications for one daily digest instead of sending each at once.</summary>
    public bool Digest { get; private set; }

    public DateTimeOffset UpdatedAt { get; private set; }

    /// <summary>The settings of a person who never changed them.</summary>
    public static NotificationSettings Defaults(string userId) =>
        new() { UserId = userId, Events = NotificationEvents.All, ByEmail = true };

    /// <summary>Replaces the choices. A new webhook address gets a new secret when it has none.</summary>
    /// <param name="webhookUrl">Null or blank for no webhook; the caller has checked the address (<c>WebhookTarget</c>).</param>
    public void Change(NotificationEvents events, bool byEmail, string? webhookUrl, bool digest, DateTimeOffset now)
    {
        Events = events & NotificationEvents.All;
        ByEmail = byEmail;
        WebhookUrl = string.IsNullOrWhiteSpace(webhookUrl) ? null : webhookUrl.Trim();
        if (WebhookUrl is not null && WebhookSecret is null)
        {
            WebhookSecret = NewSecret();
        }

        Digest = digest;
        UpdatedAt = now;
    }

    /// <summary>Makes a new webhook secret (the old one stops verifying at once).</summary>
    public void RenewSecret(DateTimeOffset now)
    {
        WebhookSecret = NewSecret();
        UpdatedAt = now;
    }

    /// <summary>True when the person wants <paramref name="kind"/> (a test message is always wanted).</summary>
    public bool Wants(string kind) => kind == NotificationKind.Test || (Events & NotificationKind.EventOf(kind)) != 0;

    private static string NewSecret() => "whsec_" + Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(24));
}
