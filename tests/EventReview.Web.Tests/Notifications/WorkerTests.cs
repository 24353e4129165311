using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Notifications;

/// <summary>The background worker runs by itself (every second here): an assignment arrives by e-mail without anyone driving it.</summary>
public sealed class WorkerTests : IAsyncLifetime
{
    private readonly NotificationFactory _app = new() { PollSeconds = 1 };

    public Task InitializeAsync() => ((IAsyncLifetime)_app).InitializeAsync();

    public Task DisposeAsync() => ((IAsyncLifetime)_app).DisposeAsync();

    [Fact]
    public async Task The_worker_sends_an_assignment_mail_by_itself()
    {
        var h = new NotificationHarness(_app);
        var (_, _, email) = await h.PersonAsync(Who.ReviewerB);
        var c = await h.OpenCaseAsync();

        await h.AssignAsync(c.Id, "triage.environment", Who.ReviewerB);

        var mail = await _app.Smtp.WaitForAsync(m => (m.Subject ?? string.Empty).Contains(c.CandidateId, StringComparison.Ordinal) && (m.Subject ?? string.Empty).Contains("assigned to you", StringComparison.Ordinal), seconds: 60);
        Assert.Equal(email, mail.To.Mailboxes.Single().Address);
    }
}
