using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Injections;
using EventReview.Core.Tests.Builders;

namespace EventReview.Core.Tests.Injections;

public class SealedRecordOpeningTests
{
    private const string OpenItem = "injection.blind-open";

    private static ReviewCase CandidateReview() => new CaseBuilder()
        .WithTemplate(ChecklistTemplateLoader.LoadFile(Path.Combine(AppContext.BaseDirectory, "checklists", "candidate-review.yaml")))
        .Build();

    private static void SignOff(ReviewCase c, ChecklistItem item)
    {
        c.PrepareForSignOff(item.Key, People.ReviewerA, Clock.T0);
        Actor[] signers = [People.ReviewerB, People.ReviewerC, People.Coordinator];
        for (var k = 0; k < item.RequiredSignOffs; k++)
        {
            c.SignNow(item.Key, signers[k], Clock.T0);
        }
    }

    private static void SignSections(ReviewCase c, Func<ChecklistItem, bool> which)
    {
        foreach (var item in c.Items.Where(which).ToList())
        {
            SignOff(c, item);
        }
    }

    [Fact]
    public void In_the_candidate_review_the_record_waits_for_sections_2_to_6()
    {
        var c = CandidateReview();

        var sections = SealedRecordOpening.RequiredSections(c, OpenItem).Select(s => s.Title).ToList();

        // The checklist's own guidance: "Open the sealed record only when every item of sections 2-6 is signed."
        Assert.Equal(["2. Detectors nominal and frozen", "3. Consistent across sites", "4. Nothing local explains it", "5. Data chain not tampered with", "6. It is significant"], sections);
    }

    [Fact]
    public void Opening_at_one_signed_item_is_refused_and_names_what_is_missing()
    {
        var c = CandidateReview();
        SignOff(c, c.Item("injection.schedule"));

        var d = SealedRecordOpening.Decide(c, OpenItem);

        Assert.False(d.Allowed);
        Assert.False(d.Overridden);
        Assert.Contains("state.observing-mode", d.Unsigned);
        Assert.DoesNotContain("signoff.all-items", d.Unsigned);
        Assert.Contains("written reason", d.Reason, StringComparison.Ordinal);
        Assert.Equal("sections-unsigned", OpeningDecision.Rule);
    }

    [Fact]
    public void One_unsigned_item_in_section_6_still_refuses_though_nearly_everything_is_signed()
    {
        // Adversarial: a count such as "33 of 36 signed" looks nearly done, but the one open item is a significance item.
        var c = CandidateReview();
        SignSections(c, i => i.SectionOrder > 0 && i.Key != "significance.far");

        var d = SealedRecordOpening.Decide(c, OpenItem);

        Assert.False(d.Allowed);
        Assert.Equal(["significance.far"], d.Unsigned);
    }

    [Fact]
    public void With_sections_2_to_6_signed_it_may_be_opened_while_the_sign_off_and_dossier_sections_are_still_open()
    {
        var c = CandidateReview();
        var required = SealedRecordOpening.RequiredSections(c, OpenItem).Select(s => s.Key).ToHashSet();
        SignSections(c, i => required.Contains(i.SectionKey));

        var d = SealedRecordOpening.Decide(c, OpenItem);

        Assert.True(d.Allowed);
        Assert.False(d.Overridden);
        Assert.Empty(d.Unsigned);
        Assert.NotEqual(ItemState.SignedOff, c.Item("signoff.all-items").State);
    }

    [Theory]
    [InlineData(null, false)]
    [InlineData("   ", false)]
    [InlineData("ok", false)]
    [InlineData("The holders must leave the collaboration tomorrow; opened early with the committee chair's agreement.", true)]
    public void A_coordinator_override_needs_a_written_reason(string? reason, bool allowed)
    {
        var c = CandidateReview();

        var d = SealedRecordOpening.Decide(c, OpenItem, reason);

        Assert.Equal(allowed, d.Allowed);
        Assert.Equal(allowed, d.Overridden);
        if (allowed)
        {
            Assert.Contains(reason!, d.Reason, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void The_override_and_its_reason_go_into_the_timeline()
    {
        var c = CandidateReview();

        c.RecordOverride(OpenItem, OpeningDecision.Rule, "Opened early at the committee chair's request.", People.Coordinator, Clock.T0);

        var entry = c.Timeline.MaxBy(a => a.Sequence)!;
        Assert.Equal("override", entry.Kind);
        Assert.Equal(OpenItem, entry.ItemKey);
        Assert.Contains("sections-unsigned", entry.Text, StringComparison.Ordinal);
        Assert.Contains("committee chair's request", entry.Text, StringComparison.Ordinal);
        Assert.Null(TimelineChain.FirstProblem(c.Timeline));
        Assert.Throws<ArgumentException>(() => c.RecordOverride(OpenItem, OpeningDecision.Rule, " ", People.Coordinator, Clock.T0));
    }
}
