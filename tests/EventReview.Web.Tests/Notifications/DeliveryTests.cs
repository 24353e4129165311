using System.Diagnostics;
using System.Text.Json;
using EventReview.Core.Notifications;
using EventReview.Data.Notifications;
using EventReview.Web.Notifications;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Notifications;

/// <summary>
/// How messages travel: signed webhooks to a local receiver, retries with back-off when the receiver or the SMTP server
/// is down (never holding up the review action, never losing the message), the daily digest, and people's choices.
/// </summary>
public sealed class DeliveryTests(NotificationFactory app) : IClassFixture<NotificationFactory>
{
    private readonly NotificationHarness _h = new(app);

    [Fact]
    public async Task A_webhook_gets_signed_json_and_a_refusing_receiver_is_retried_with_back_off_until_it_accepts()
    {
        await using var receiver = await WebhookReceiver.StartAsync();
        await _h.ChooseAsync(Who.Reviewer, NotificationEvents.Assigned, byEmail: false, webhook: receiver.Url);
        var (principal, _, email) = await _h.PersonAsync(Who.Reviewer);
        var secret = (await _h.Get<NotificationProfile>().GetAsync(principal)).WebhookSecret!;
        var c = await _h.OpenCaseAsync();
        receiver.RefuseNext(2);

        await _h.AssignAsync(c.Id, "triage.injections", Who.Reviewer);
        await app.PumpAsync();
        var message = Assert.Single(await _h.OutboxToAsync(receiver.Url));
        Assert.Equal(("retrying", 1), (message.Status, message.Attempts));
        Assert.Contains("503", message.LastError, StringComparison.Ordinal);
        Assert.InRange((message.NextAttemptAt - app.Clock.GetUtcNow()).TotalSeconds, 28, 30);

        await app.PumpAsync(); // not due yet: no attempt
        Assert.Single(receiver.Requests);

        app.Clock.Advance(TimeSpan.FromSeconds(31));
        await app.PumpAsync();
        message = Assert.Single(await _h.OutboxToAsync(receiver.Url));
        Assert.Equal(("retrying", 2), (message.Status, message.Attempts));
        Assert.InRange((message.NextAttemptAt - app.Clock.GetUtcNow()).TotalSeconds, 58, 60);

        app.Clock.Advance(TimeSpan.FromSeconds(61));
        await app.PumpAsync();
        message = Assert.Single(await _h.OutboxToAsync(receiver.Url));
        Assert.Equal(("sent", 3), (message.Status, message.Attempts));

        var accepted = receiver.Requests.Single(r => !r.Refused);
        Assert.True(WebhookSignature.Verify(secret, accepted.Headers[WebhookSignature.TimestampHeader], accepted.Headers[WebhookSignature.SignatureHeader], accepted.Body, app.Clock.GetUtcNow()));
        Assert.False(WebhookSignature.Verify("whsec_someone-else", accepted.Headers[WebhookSignature.TimestampHeader], accepted.Headers[WebhookSignature.SignatureHeader], accepted.Body, app.Clock.GetUtcNow()));
        Assert.Equal(message.Id.ToString(System.Globalization.CultureInfo.InvariantCulture), accepted.Headers["X-EventReview-Delivery"]);
        using var json = JsonDocument.Parse(accepted.Body);
        Assert.Equal(NotificationKind.Assigned, json.RootElement.GetProperty("event").GetString());
        Assert.Equal(email, json.RootElement.GetProperty("recipient").GetString());
        Assert.Equal(c.Id, json.RootElement.GetProperty("caseId").GetInt32());
        Assert.Equal($"https://review.example.org/cases/{c.Id}/items/triage.injections", json.RootElement.GetProperty("link").GetString());
    }

    [Fact]
    public async Task Kinds_a_person_did_not_choose_are_not_sent()
    {
        await using var receiver = await WebhookReceiver.StartAsync();
        await _h.ChooseAsync(Who.Observer, NotificationEvents.Due, byEmail: false, webhook: receiver.Url);
        var c = await _h.OpenCaseAsync();

        await _h.AssignAsync(c.Id, "triage.freeze", Who.Observer);
        await app.PumpAsync();

        Assert.DoesNotContain(receiver.Requests, r => r.Body.Contains("\"item.assigned\"", StringComparison.Ordinal));
        await using var db = app.Db();
        var (_, id, _) = await _h.PersonAsync(Who.Observer);
        Assert.Contains(await db.Notifications.Where(n => n.UserId == id && n.Kind == NotificationKind.Assigned && n.CaseId == c.Id).Select(n => n.Route).ToListAsync(), r => r == "not wanted");
    }

    [Fact]
    public async Task A_digest_holds_notifications_until_the_digest_hour_and_sends_them_in_one_message()
    {
        var (_, _, email) = await _h.PersonAsync(Who.ReviewerB);
        await _h.ChooseAsync(Who.ReviewerB, NotificationEvents.Assigned, digest: true);
        var now = app.Clock.GetUtcNow();
        app.Clock.Set(new DateTimeOffset(now.Year, now.Month, now.Day, 5, 30, 0, TimeSpan.Zero).AddDays(1)); // tomorrow 05:30 UTC
        var c = await _h.OpenCaseAsync();
        await _h.AssignAsync(c.Id, "triage.timing", Who.ReviewerB);
        await _h.AssignAsync(c.Id, "triage.overlap", Who.ReviewerB);

        await app.PumpAsync();
        app.Clock.Advance(TimeSpan.FromMinutes(80)); // 06:50: still before the 07:00 digest
        await app.PumpAsync();
        Assert.Empty(_h.MailsTo(email, "Daily digest"));
        Assert.Empty(_h.MailsTo(email, $"{c.CandidateId}:"));

        app.Clock.Advance(TimeSpan.FromMinutes(11)); // 07:01
        await app.PumpAsync();
        await app.PumpAsync();

        var digest = Assert.Single(_h.MailsTo(email, "Daily digest"));
        Assert.Contains("2 notification(s)", digest.Subject, StringComparison.Ordinal);
        Assert.Contains($"{c.CandidateId}: 'Arrival-time difference is within the light-travel window' assigned to you", digest.TextBody, StringComparison.Ordinal);
        Assert.Contains($"https://review.example.org/cases/{c.Id}/items/triage.overlap", digest.TextBody, StringComparison.Ordinal);
        Assert.Empty(_h.MailsTo(email, $"{c.CandidateId}:"));
        await _h.ChooseAsync(Who.ReviewerB, digest: false);
    }

    [Fact]
    public async Task A_test_message_goes_at_once_even_with_the_digest()
    {
        var (principal, _, email) = await _h.PersonAsync(Who.Observer);
        await _h.ChooseAsync(Who.Observer, digest: true);

        await _h.Get<NotificationProfile>().SendTestAsync(principal);
        await app.PumpAsync();

        Assert.Contains("If you read this, the channel works.", Assert.Single(_h.MailsTo(email, "Test message")).TextBody, StringComparison.Ordinal);
        await _h.ChooseAsync(Who.Observer, digest: false);
    }

    [Fact]
    public async Task A_webhook_address_that_is_not_acceptable_is_refused_with_the_reason_and_nothing_is_saved()
    {
        var (principal, _, _) = await _h.PersonAsync(Who.Coordinator);
        var profile = _h.Get<NotificationProfile>();
        var before = await profile.GetAsync(principal);

        var ex = await Assert.ThrowsAsync<ArgumentException>(() => profile.SaveAsync(principal, NotificationEvents.All, true, "ftp://hooks.example.org/x", false));

        Assert.Contains("must be an absolute http or https address", ex.Message, StringComparison.Ordinal);
        Assert.Equal(before.WebhookUrl, (await profile.GetAsync(principal)).WebhookUrl);
        var token = new System.Security.Claims.ClaimsPrincipal(new System.Security.Claims.ClaimsIdentity(
            [new(System.Security.Claims.ClaimTypes.NameIdentifier, "token:1"), new(EventReview.Web.Auth.UserClaims.TokenId, "1")], "ApiToken"));
        await Assert.ThrowsAsync<UnauthorizedAccessException>(() => profile.GetAsync(token));
    }

    [Fact]
    public async Task The_profile_page_shows_the_choices_and_the_recent_messages()
    {
        var client = await app.As(Who.Reviewer);

        var html = System.Net.WebUtility.HtmlDecode(await client.GetStringAsync("/profile"));

        Assert.Contains("Tell me when", html, StringComparison.Ordinal);
        Assert.Contains("By e-mail to reviewer.a@demo.invalid", html, StringComparison.Ordinal);
        Assert.Contains("In one daily digest at 07:00 UTC", html, StringComparison.Ordinal);
        Assert.Contains("Recent messages to you", html, StringComparison.Ordinal);
    }
}
