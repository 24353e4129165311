using System.Text.Json;
using EventReview.Core.Notifications;
using EventReview.Data.Notifications;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Notifications;

/// <summary>
/// The words of messages: a plain-text e-mail, and the JSON body of a webhook (camelCase; <c>event</c> is the
/// <see cref="NotificationKind"/>), for one notification or a day's digest. Links are made absolute with
/// <see cref="NotificationOptions.BaseUrl"/>.
/// </summary>
public sealed class NotificationComposer(IOptions<NotificationOptions> options)
{
    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);

    private const string Footer = "You get this because of the notification choices in your EventReview profile ({0}). " +
        "EventReview computes and records; decisions rest with the people who sign, under their collaboration's own procedures.";

    private static readonly System.Text.CompositeFormat FooterFormat = System.Text.CompositeFormat.Parse(Footer);

    /// <summary><paramref name="path"/> with the server's public address in front, when one is configured.</summary>
    public string Link(string path) =>
        string.IsNullOrWhiteSpace(options.Value.BaseUrl) ? path : options.Value.BaseUrl.TrimEnd('/') + path;

    public (string Subject, string Body) Email(Notification n) =>
        ("[EventReview] " + n.Subject, $"{n.Text}\n\nOpen: {Link(n.Link)}\n\n-- \n{string.Format(System.Globalization.CultureInfo.InvariantCulture, FooterFormat, Link("/profile"))}\n");

    public string Webhook(Notification n, string recipient) => JsonSerializer.Serialize(Item(n, recipient), Json);

    public (string Subject, string Body) DigestEmail(IReadOnlyList<Notification> list, DateTimeOffset now)
    {
        var lines = list.OrderBy(n => n.CreatedAt).Select(n =>
            $"- {n.CreatedAt.UtcDateTime:yyyy-MM-dd HH:mm} UTC, {NotificationKind.Label(n.Kind)}: {n.Subject}\n  {n.Text}\n  {Link(n.Link)}");
        return ($"[EventReview] Daily digest for {now.UtcDateTime:yyyy-MM-dd}: {list.Count} notification(s)",
            $"What happened since your last digest ({list.Count}):\n\n{string.Join("\n\n", lines)}\n\n-- \n{string.Format(System.Globalization.CultureInfo.InvariantCulture, FooterFormat, Link("/profile"))}\n");
    }

    public string DigestWebhook(IReadOnlyList<Notification> list, string recipient, DateTimeOffset now) => JsonSerializer.Serialize(new
    {
        @event = NotificationKind.Digest,
        recipient,
        createdAt = now.UtcDateTime,
        items = list.OrderBy(n => n.CreatedAt).Select(n => Item(n, null)),
    }, Json);

    private WebhookItem Item(Notification n, string? recipient) =>
        new(n.Kind, n.Id, recipient, n.CreatedAt.UtcDateTime, n.Subject, n.Text, Link(n.Link), n.CaseId, n.ItemKey);

    /// <summary>One notification in a webhook body (the recipient only on a single notification, not inside a digest).</summary>
    private sealed record WebhookItem(
        string Event,
        long Id,
        [property: System.Text.Json.Serialization.JsonIgnore(Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)] string? Recipient,
        DateTime CreatedAt,
        string Subject,
        string Text,
        string Link,
        int? CaseId,
        string? ItemKey);
}
