using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Notifications;
using EventReview.Data.Notifications;
using EventReview.Web.Notifications;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Notifications;

/// <summary>The demo people as principals with their real account ids, and small steps the notification tests share.</summary>
public sealed class NotificationHarness(NotificationFactory app)
{
    public NotificationFactory App => app;

    public T Get<T>() where T : notnull => app.Services.CreateScope().ServiceProvider.GetRequiredService<T>();

    /// <summary>The demo person (see <see cref="Who"/>) with their account id and e-mail.</summary>
    public async Task<(ClaimsPrincipal Principal, string Id, string Email)> PersonAsync(string who)
    {
        var account = EventReviewFactory.AccountFor(who);
        await using var db = app.Db();
        var id = await db.Users.Where(u => u.Email == account.Email).Select(u => u.Id).SingleAsync();
        return (Principals.Make(id, account.DisplayName, account.Role), id, account.Email);
    }

    /// <summary>A new rapid-triage case opened by the demo coordinator.</summary>
    public async Task<ReviewCase> OpenCaseAsync()
    {
        var (coordinator, _, _) = await PersonAsync(Who.Coordinator);
        var gps = 1_400_000_000.125m;
        return (await Get<CaseWorkflow>().OpenAsync(coordinator, new OpenCaseRequest(ApiCalls.NewCandidateId(), gps, "test-search", "Notifications.",
            [new ArrivalRequest("KP", gps + 0.004m, 9.5), new ArrivalRequest("AB", gps - 0.002m, 7.0)], "rapid-triage"))).Case;
    }

    /// <summary>The demo coordinator assigns <paramref name="key"/> of case <paramref name="caseId"/> to the demo person <paramref name="who"/>.</summary>
    public async Task<ReviewCase> AssignAsync(int caseId, string key, string who)
    {
        var (coordinator, _, _) = await PersonAsync(Who.Coordinator);
        var (_, id, _) = await PersonAsync(who);
        var cases = Get<CaseQueries>();
        var workflow = Get<CaseWorkflow>();
        var c = await cases.GetAsync(coordinator, caseId);
        return await workflow.AssignAsync(coordinator, caseId, key, id, EventReviewFactory.AccountFor(who).DisplayName, c.Item(key).Version);
    }

    /// <summary>Sets the demo person's notification choices.</summary>
    public async Task ChooseAsync(string who, NotificationEvents events = NotificationEvents.All, bool byEmail = true, string? webhook = null, bool digest = false)
    {
        var (principal, _, _) = await PersonAsync(who);
        await Get<NotificationProfile>().SaveAsync(principal, events, byEmail, webhook, digest);
    }

    /// <summary>The messages in the outbox to <paramref name="target"/>, oldest first.</summary>
    public async Task<List<OutboxMessage>> OutboxToAsync(string target)
    {
        await using var db = app.Db();
        return await db.OutboxMessages.AsNoTracking().Where(m => m.Target == target).OrderBy(m => m.Id).ToListAsync();
    }

    /// <summary>Mails received so far for <paramref name="email"/> whose subject contains <paramref name="text"/>.</summary>
    public List<MimeKit.MimeMessage> MailsTo(string email, string text) =>
        app.Smtp.Messages.Where(m => m.To.Mailboxes.Any(b => b.Address == email) && (m.Subject ?? string.Empty).Contains(text, StringComparison.Ordinal)).ToList();
}
