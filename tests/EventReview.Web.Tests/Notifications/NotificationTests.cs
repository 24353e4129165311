using EventReview.Core.Evidence;
using EventReview.Core.Notifications;
using EventReview.Data;
using EventReview.Web.Notifications;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Notifications;

/// <summary>
/// Each event reaches the person by e-mail (an SMTP server started in the test), read from the timeline, the due dates
/// and verification results by the notification worker, with the clock under the test's control.
/// </summary>
public sealed class NotificationTests(NotificationFactory app) : IClassFixture<NotificationFactory>
{
    private readonly NotificationHarness _h = new(app);

    [Fact]
    public async Task An_item_assigned_to_you_is_e_mailed_to_you_once_with_a_link()
    {
        var (_, _, email) = await _h.PersonAsync(Who.Reviewer);
        await _h.ChooseAsync(Who.Reviewer);
        var c = await _h.OpenCaseAsync();

        await _h.AssignAsync(c.Id, "triage.timing", Who.Reviewer);
        await app.PumpAsync();
        await app.PumpAsync();

        var mail = Assert.Single(_h.MailsTo(email, $"{c.CandidateId}: 'Arrival-time difference is within the light-travel window' assigned to you"));
        Assert.Equal("review-noreply@example.org", mail.From.Mailboxes.Single().Address);
        Assert.Contains($"https://review.example.org/cases/{c.Id}/items/triage.timing", mail.TextBody, StringComparison.Ordinal);
        Assert.Contains("Demo Coordinator assigned you the checklist item", mail.TextBody, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Due_tomorrow_and_overdue_follow_the_clock_and_are_each_told_once()
    {
        var (_, _, email) = await _h.PersonAsync(Who.ReviewerB);
        await _h.ChooseAsync(Who.ReviewerB, NotificationEvents.Due);
        var (coordinator, _, _) = await _h.PersonAsync(Who.Coordinator);
        var c = await _h.OpenCaseAsync();
        c = await _h.AssignAsync(c.Id, "triage.state", Who.ReviewerB);
        var today = DueRule.UtcDay(app.Clock.GetUtcNow());
        await _h.Get<CaseWorkflow>().SetDueAsync(coordinator, c.Id, "triage.state", today.AddDays(2), c.Item("triage.state").Version);

        await app.PumpAsync();
        Assert.Empty(_h.MailsTo(email, c.CandidateId)); // due in two days: nothing yet

        app.Clock.Advance(TimeSpan.FromDays(1));
        await app.PumpAsync();
        await app.PumpAsync();
        var tomorrow = Assert.Single(_h.MailsTo(email, c.CandidateId));
        Assert.Contains($"is due tomorrow ({today.AddDays(2):yyyy-MM-dd})", tomorrow.Subject, StringComparison.Ordinal);

        app.Clock.Advance(TimeSpan.FromDays(2));
        await app.PumpAsync();
        await app.PumpAsync();
        var mails = _h.MailsTo(email, c.CandidateId);
        Assert.Equal(2, mails.Count);
        Assert.Contains("is overdue", mails[1].Subject, StringComparison.Ordinal);
        Assert.Contains("1 day(s) ago", mails[1].TextBody, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_sign_off_gone_stale_is_told_to_its_signer_not_to_the_person_who_changed_the_evidence()
    {
        var (reviewerA, _, emailA) = await _h.PersonAsync(Who.Reviewer);
        var (reviewerB, _, emailB) = await _h.PersonAsync(Who.ReviewerB);
        await _h.ChooseAsync(Who.Reviewer);
        await _h.ChooseAsync(Who.ReviewerB);
        var appender = _h.Get<EvidenceAppender>();
        var workflow = _h.Get<CaseWorkflow>();
        var c = await _h.OpenCaseAsync();
        await appender.AddNoteAsync(reviewerA, c.Id, "triage.overlap", "Overlap looks right.");
        c = await workflow.TransitionAsync(reviewerA, c.Id, "triage.overlap", "ready", null);
        c = await workflow.SignAsync(reviewerB, c.Id, "triage.overlap", SignOffMeaning.Reviewed, "Checked.", c.Item("triage.overlap").Fingerprint(), await Signers.ProofAsync(_h.App.Services, reviewerB));
        await app.PumpAsync();

        await appender.AddNoteAsync(reviewerA, c.Id, "triage.overlap", "Correction: the band was wrong.");
        await app.PumpAsync();

        var stale = Assert.Single(_h.MailsTo(emailB, $"{c.CandidateId}: your sign-off"));
        Assert.Contains("is stale", stale.Subject, StringComparison.Ordinal);
        Assert.Contains("Demo Reviewer A added to the evidence", stale.TextBody, StringComparison.Ordinal);
        Assert.Empty(_h.MailsTo(emailA, $"{c.CandidateId}: your sign-off"));
    }

    [Fact]
    public async Task A_case_whose_last_item_is_signed_is_told_to_its_coordinator_as_ready_for_decision()
    {
        var (reviewerA, _, _) = await _h.PersonAsync(Who.Reviewer);
        var (reviewerB, _, _) = await _h.PersonAsync(Who.ReviewerB);
        var (coordinator, _, coordinatorEmail) = await _h.PersonAsync(Who.Coordinator);
        await _h.ChooseAsync(Who.Coordinator);
        var appender = _h.Get<EvidenceAppender>();
        var workflow = _h.Get<CaseWorkflow>();
        var c = await _h.OpenCaseAsync();
        var keys = c.Items.Select(i => i.Key).ToList();
        for (var k = 0; k < keys.Count; k++)
        {
            await appender.AddNoteAsync(reviewerA, c.Id, keys[k], "Done.");
            c = await workflow.TransitionAsync(reviewerA, c.Id, keys[k], "ready", null);
            c = await workflow.SignAsync(reviewerB, c.Id, keys[k], SignOffMeaning.Reviewed, "Checked.", c.Item(keys[k]).Fingerprint(), await Signers.ProofAsync(_h.App.Services, reviewerB));
            if (c.Item(keys[k]).State != Core.Checklists.ItemState.SignedOff)
            {
                c = await workflow.SignAsync(coordinator, c.Id, keys[k], SignOffMeaning.Approved, "Agreed.", c.Item(keys[k]).Fingerprint(), await Signers.ProofAsync(_h.App.Services, coordinator));
            }

            await app.PumpAsync();
            if (k < keys.Count - 1)
            {
                Assert.Empty(_h.MailsTo(coordinatorEmail, $"{c.CandidateId}: every item"));
            }
        }

        var ready = Assert.Single(_h.MailsTo(coordinatorEmail, $"{c.CandidateId}: every item is signed off, ready for decision"));
        Assert.Contains($"All {keys.Count} checklist items", ready.TextBody, StringComparison.Ordinal);
        Assert.Contains("the decision rests with the decision board", ready.TextBody, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_verification_that_finds_a_changed_file_is_told_to_the_coordinators()
    {
        var (reviewerA, _, _) = await _h.PersonAsync(Who.Reviewer);
        var (_, _, coordinatorEmail) = await _h.PersonAsync(Who.Coordinator);
        await _h.ChooseAsync(Who.Coordinator);
        var c = await _h.OpenCaseAsync();
        var receipt = await _h.Get<EvidenceAppender>().AppendAttachmentAsync(reviewerA, c.Id, "triage.state", new MemoryStream("segment list v1"u8.ToArray()),
            "segments.txt", "text/plain", "Segments.", 1024);

        // Someone changes the stored file behind the app's back; "Verify this case" finds it and reports it.
        var path = app.Services.GetRequiredService<AttachmentStore>().PathFor(receipt.ContentSha256);
        File.SetAttributes(path, FileAttributes.Normal);
        await File.WriteAllTextAsync(path, "segment list v2");
        var result = (await app.Services.GetRequiredService<IntegrityVerifier>().VerifyAsync(c.Id)).Cases.Single();
        Assert.False(result.Valid);
        await app.Services.GetRequiredService<VerifyFailureReporter>().ReportAsync($"\"Verify this case\" on case {c.CandidateId}", result.Problems);
        await app.Services.GetRequiredService<VerifyFailureReporter>().ReportAsync($"\"Verify this case\" on case {c.CandidateId}", result.Problems);
        await app.PumpAsync();

        var mail = Assert.Single(_h.MailsTo(coordinatorEmail, "Verification found"));
        Assert.Contains($"\"Verify this case\" on case {c.CandidateId}", mail.TextBody, StringComparison.Ordinal);
        Assert.Contains("https://review.example.org/integrity", mail.TextBody, StringComparison.Ordinal);
    }
}
