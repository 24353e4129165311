using System.Diagnostics;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Notifications;

/// <summary>
/// An SMTP server that is down never holds up a review action; its messages wait in the outbox, are retried with
/// back-off and go out once it is back; past the give-up time they stay, marked given up, never silently dropped.
/// </summary>
public sealed class UnreachableServerTests : IAsyncLifetime
{
    private readonly TestSmtpServer _later = new();
    private NotificationFactory _app = default!;

    public async Task InitializeAsync()
    {
        _app = new NotificationFactory { SmtpPort = _later.Port }; // nothing listens there yet
        await ((IAsyncLifetime)_app).InitializeAsync();
    }

    public async Task DisposeAsync()
    {
        await ((IAsyncLifetime)_app).DisposeAsync();
        await _later.DisposeAsync();
    }

    [Fact]
    public async Task Review_actions_do_not_wait_and_the_mail_goes_out_once_the_server_is_back()
    {
        var h = new NotificationHarness(_app);
        var (_, _, email) = await h.PersonAsync(Who.Reviewer);
        await h.ChooseAsync(Who.Reviewer, Core.Notifications.NotificationEvents.Assigned);
        var c = await h.OpenCaseAsync();

        var watch = Stopwatch.StartNew();
        await h.AssignAsync(c.Id, "triage.timing", Who.Reviewer);
        watch.Stop();
        await _app.PumpAsync();

        var waiting = Assert.Single(await h.OutboxToAsync(email), m => m.Kind == "item.assigned" && m.Body.Contains(c.CandidateId, StringComparison.Ordinal));
        Assert.Equal(("retrying", 1), (waiting.Status, waiting.Attempts));
        Assert.Contains($"SMTP server 127.0.0.1:{_later.Port} not reachable", waiting.LastError, StringComparison.Ordinal);
        Assert.True(watch.Elapsed < TimeSpan.FromSeconds(30), $"the assignment took {watch.Elapsed}"); // it never touched the mail server

        _later.Start();
        await _app.PumpAsync(); // the retry is not due yet
        Assert.Empty(_later.Messages);

        _app.Clock.Advance(TimeSpan.FromSeconds(31));
        await _app.PumpAsync();
        var mail = await _later.WaitForAsync(m => (m.Subject ?? string.Empty).Contains(c.CandidateId, StringComparison.Ordinal) && (m.Subject ?? string.Empty).Contains("assigned to you", StringComparison.Ordinal));
        Assert.Equal(email, mail.To.Mailboxes.Single().Address);
        var sent = Assert.Single(await h.OutboxToAsync(email), m => m.Kind == "item.assigned" && m.Body.Contains(c.CandidateId, StringComparison.Ordinal));
        Assert.Equal(("sent", 2), (sent.Status, sent.Attempts));
    }

    [Fact]
    public async Task A_message_that_cannot_be_delivered_for_days_is_kept_and_marked_given_up()
    {
        var h = new NotificationHarness(_app);
        var (principal, _, email) = await h.PersonAsync(Who.Observer);
        await h.Get<EventReview.Web.Notifications.NotificationProfile>().SendTestAsync(principal);
        await _app.PumpAsync();

        for (var hour = 0; hour < 74; hour++)
        {
            _app.Clock.Advance(TimeSpan.FromHours(1));
            await _app.PumpAsync();
        }

        var message = Assert.Single(await h.OutboxToAsync(email), m => m.Kind == "test");
        Assert.Equal("given up", message.Status);
        Assert.InRange(message.Attempts, 70, 80);
        Assert.Contains("not reachable", message.LastError, StringComparison.Ordinal);
        await using var db = _app.Db();
        Assert.True(await db.Notifications.AnyAsync(n => n.Kind == "test" && n.RoutedAt != null));
    }
}
