using EventReview.Core.Notifications;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;
using Microsoft.AspNetCore.Hosting;

namespace EventReview.Web.Tests.Notifications;

/// <summary>
/// The notification worker on PostgreSQL (a team server's database): the timeline is read only a few seconds behind
/// (entries of transactions still committing are not passed over), then assignment and due notices go out as on SQLite.
/// </summary>
public sealed class PostgresNotificationTests : IAsyncLifetime
{
    private PostgresFactory _app = default!;

    public async Task InitializeAsync()
    {
        _app = new PostgresFactory(await PostgresDatabases.FreshAsync("er_notify"));
        await ((IAsyncLifetime)_app).InitializeAsync();
    }

    public async Task DisposeAsync()
    {
        await ((IAsyncLifetime)_app).DisposeAsync();
        Npgsql.NpgsqlConnection.ClearAllPools();
    }

    [Fact]
    public async Task Assignment_and_due_notices_are_e_mailed_once_the_timeline_has_settled()
    {
        var h = new NotificationHarness(_app);
        var (_, _, email) = await h.PersonAsync(Who.Reviewer);
        await h.ChooseAsync(Who.Reviewer, NotificationEvents.Assigned | NotificationEvents.Due);
        var (coordinator, _, _) = await h.PersonAsync(Who.Coordinator);
        var c = await h.OpenCaseAsync();
        c = await h.AssignAsync(c.Id, "triage.freeze", Who.Reviewer);
        await h.Get<CaseWorkflow>().SetDueAsync(coordinator, c.Id, "triage.freeze", DueRule.UtcDay(_app.Clock.GetUtcNow()).AddDays(1), c.Item("triage.freeze").Version);

        await _app.PumpAsync();
        Assert.DoesNotContain(h.MailsTo(email, c.CandidateId), m => (m.Subject ?? string.Empty).Contains("assigned to you", StringComparison.Ordinal)); // not settled yet

        _app.Clock.Advance(TimeSpan.FromSeconds(5));
        await _app.PumpAsync();
        await _app.PumpAsync();

        var mails = h.MailsTo(email, c.CandidateId);
        Assert.Single(mails, m => (m.Subject ?? string.Empty).Contains("assigned to you", StringComparison.Ordinal));
        Assert.Single(mails, m => (m.Subject ?? string.Empty).Contains("is due tomorrow", StringComparison.Ordinal));
    }

    private sealed class PostgresFactory(string connection) : NotificationFactory
    {
        protected override void ConfigureWebHost(IWebHostBuilder builder)
        {
            base.ConfigureWebHost(builder);
            builder.UseSetting("Database:Provider", "Postgres");
            builder.UseSetting("ConnectionStrings:Default", connection);
        }
    }
}
