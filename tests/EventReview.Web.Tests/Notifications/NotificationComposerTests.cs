using System.Text.Json;
using EventReview.Data.Notifications;
using EventReview.Web.Notifications;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Tests.Notifications;

public sealed class NotificationComposerTests
{
    private static readonly DateTimeOffset At = new(2027, 3, 1, 7, 0, 4, TimeSpan.Zero);

    private static Notification Due(string key) =>
        Notification.Create("u1", "item.due", 4, key, $"ER-C-0101: '{key}' is due tomorrow (2027-03-02)", "The checklist item ...", $"/cases/4/items/{key}", $"item.due:u1:{key}", At);

    private readonly NotificationComposer _compose = new(Options.Create(new NotificationOptions { BaseUrl = "https://review.example.org/" }));

    [Fact]
    public void A_webhook_body_names_the_event_the_recipient_and_an_absolute_link()
    {
        using var json = JsonDocument.Parse(_compose.Webhook(Due("triage.timing"), "ada@example.org"));
        var root = json.RootElement;

        Assert.Equal(["event", "id", "recipient", "createdAt", "subject", "text", "link", "caseId", "itemKey"], root.EnumerateObject().Select(p => p.Name));
        Assert.Equal("item.due", root.GetProperty("event").GetString());
        Assert.Equal("https://review.example.org/cases/4/items/triage.timing", root.GetProperty("link").GetString());
        Assert.Equal("2027-03-01T07:00:04Z", root.GetProperty("createdAt").GetString());
    }

    [Fact]
    public void A_digest_body_holds_the_items_oldest_first_without_repeating_the_recipient()
    {
        using var json = JsonDocument.Parse(_compose.DigestWebhook([Due("b.second"), Due("a.first")], "ada@example.org", At.AddHours(1)));
        var root = json.RootElement;

        Assert.Equal(("digest", "ada@example.org"), (root.GetProperty("event").GetString(), root.GetProperty("recipient").GetString()));
        var items = root.GetProperty("items").EnumerateArray().ToList();
        Assert.Equal(2, items.Count);
        Assert.All(items, i => Assert.False(i.TryGetProperty("recipient", out _)));
        Assert.Equal("item.due", items[0].GetProperty("event").GetString());
    }

    [Fact]
    public void An_email_has_the_subject_the_text_the_link_and_why_it_was_sent()
    {
        var (subject, body) = _compose.Email(Due("triage.timing"));

        Assert.Equal("[EventReview] ER-C-0101: 'triage.timing' is due tomorrow (2027-03-02)", subject);
        Assert.Contains("Open: https://review.example.org/cases/4/items/triage.timing", body, StringComparison.Ordinal);
        Assert.Contains("notification choices in your EventReview profile (https://review.example.org/profile)", body, StringComparison.Ordinal);
    }
}
