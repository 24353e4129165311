using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Tests.Builders;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Checklists;

public partial class ChecklistItemTransitionTests
{
    private readonly ReviewCase _case = new CaseBuilder().Build();

    [Fact]
    public void Starting_an_open_item_puts_it_in_progress_and_the_case_in_review()
    {
        _case.StartItem("alpha.one", People.ReviewerA, Clock.At(1));

        Assert.Equal(ItemState.InProgress, _case.Item("alpha.one").State);
        Assert.Equal(CaseState.InReview, _case.State);
        Assert.Equal("item.state", _case.Timeline[^1].Kind);
        Assert.Equal("alpha.one", _case.Timeline[^1].ItemKey);
    }

    [Fact]
    public void Starting_an_item_twice_is_refused_as_an_invalid_transition()
    {
        _case.StartItem("alpha.one", People.ReviewerA, Clock.At(1));

        var ex = Assert.Throws<DomainRuleException>(() => _case.StartItem("alpha.one", People.ReviewerA, Clock.At(2)));

        Assert.Equal("invalid-transition", ex.Rule);
        Assert.Contains("in progress", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Adding_evidence_to_an_open_item_moves_it_to_in_progress()
    {
        _case.AddNote("alpha.one", "First look.", People.ReviewerA, Clock.At(1));

        Assert.Equal(ItemState.InProgress, _case.Item("alpha.one").State);
        Assert.Equal(CaseState.InReview, _case.State);
        Assert.Equal("evidence.note", _case.Timeline[^1].Kind);
    }

    [Fact]
    public void An_item_without_evidence_cannot_be_marked_ready_for_sign_off()
    {
        _case.StartItem("alpha.one", People.ReviewerA, Clock.At(1));

        var ex = Assert.Throws<DomainRuleException>(() => _case.MarkItemReady("alpha.one", People.ReviewerA, Clock.At(2)));

        Assert.Equal("evidence-required", ex.Rule);
        Assert.Contains("alpha.one", ex.Message, StringComparison.Ordinal);
        Assert.Equal(ItemState.InProgress, _case.Item("alpha.one").State);
    }

    [Fact]
    public void An_open_item_with_evidence_can_be_marked_ready_directly()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));

        Assert.Equal(ItemState.ReadyForSignOff, _case.Item("alpha.one").State);
    }

    [Fact]
    public void A_computation_record_counts_as_evidence_for_readiness()
    {
        var record = new ComputationRecord(CheckKind.Timing, "{}", new string('a', 64), "1.0", "{}", "consistent", "ok", "", People.ReviewerA, Clock.At(1));
        _case.AddComputation("beta.one", record, People.ReviewerA, Clock.At(1));

        _case.MarkItemReady("beta.one", People.ReviewerA, Clock.At(2));

        Assert.Equal(ItemState.ReadyForSignOff, _case.Item("beta.one").State);
        Assert.Equal("computation.timing", _case.Timeline[^2].Kind);
    }

    [Fact]
    public void Marking_ready_twice_is_refused()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));

        Assert.Equal("invalid-transition", Assert.Throws<DomainRuleException>(() => _case.MarkItemReady("alpha.one", People.ReviewerA, Clock.At(2))).Rule);
    }

    [Fact]
    public void A_ready_item_without_signatures_can_be_withdrawn_to_in_progress()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));

        _case.WithdrawItem("alpha.one", People.ReviewerA, Clock.At(2));

        Assert.Equal(ItemState.InProgress, _case.Item("alpha.one").State);
    }

    [Fact]
    public void Withdrawing_an_item_that_is_not_ready_is_refused()
    {
        _case.StartItem("alpha.one", People.ReviewerA, Clock.At(1));

        Assert.Equal("invalid-transition", Assert.Throws<DomainRuleException>(() => _case.WithdrawItem("alpha.one", People.ReviewerA, Clock.At(2))).Rule);
    }

    [Fact]
    public void Withdrawing_an_item_that_already_has_a_current_signature_is_refused()
    {
        _case.PrepareForSignOff("alpha.two", People.ReviewerA, Clock.At(1));
        _case.SignNow("alpha.two", People.ReviewerB, Clock.At(2));

        var ex = Assert.Throws<DomainRuleException>(() => _case.WithdrawItem("alpha.two", People.ReviewerA, Clock.At(3)));

        Assert.Equal("withdraw-signed", ex.Rule);
        Assert.Equal(ItemState.ReadyForSignOff, _case.Item("alpha.two").State);
    }

    [Fact]
    public void An_item_can_be_signed_only_when_ready_for_sign_off()
    {
        _case.AddNote("alpha.one", "Work in progress.", People.ReviewerA, Clock.At(1));

        var ex = Assert.Throws<DomainRuleException>(() => _case.SignNow("alpha.one", People.ReviewerB, Clock.At(2)));

        Assert.Equal("not-ready", ex.Rule);
        Assert.Empty(_case.Item("alpha.one").SignOffs);
    }

    [Theory]
    [InlineData("")]
    [InlineData("   ")]
    public void A_sign_off_needs_a_statement(string statement)
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));

        Assert.Equal("statement-required", Assert.Throws<DomainRuleException>(() => _case.SignNow("alpha.one", People.ReviewerB, Clock.At(2), statement)).Rule);
    }

    [Fact]
    public void A_sign_off_records_signer_times_meaning_statement_and_the_evidence_fingerprint()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));
        var fingerprint = _case.Item("alpha.one").Fingerprint();
        var gps = GpsUtc.FromUtc(Clock.At(2).UtcDateTime);

        var s = _case.SignItem("alpha.one", People.ReviewerB, SignOffMeaning.Approved, "  Read every note.  ", fingerprint, Clock.At(2), gps);

        Assert.Equal(People.ReviewerB.UserId, s.UserId);
        Assert.Equal(People.ReviewerB.DisplayName, s.SignerName);
        Assert.Equal(Clock.At(2), s.SignedAtUtc);
        Assert.Equal(gps, s.SignedAtGps);
        Assert.Equal(SignOffMeaning.Approved, s.Meaning);
        Assert.Equal("Read every note.", s.Statement);
        Assert.Equal(fingerprint, s.EvidenceFingerprint);
        Assert.False(s.IsStale);
        Assert.Equal(ItemState.SignedOff, _case.Item("alpha.one").State);
        Assert.Equal("signoff", _case.Timeline[^1].Kind);
        Assert.Contains("Item signed off.", _case.Timeline[^1].Text, StringComparison.Ordinal);
    }

    [Fact]
    public void The_owner_cannot_sign_an_item_under_the_four_eyes_rule()
    {
        _case.AssignItem("alpha.one", People.ReviewerA.UserId, People.ReviewerA.DisplayName, People.Coordinator, Clock.At(1));
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(2));

        var ex = Assert.Throws<DomainRuleException>(() => _case.SignNow("alpha.one", People.ReviewerA, Clock.At(3)));

        Assert.Equal("four-eyes", ex.Rule);
        Assert.Contains(People.ReviewerA.DisplayName, ex.Message, StringComparison.Ordinal);
        Assert.Empty(_case.Item("alpha.one").SignOffs);
    }

    [Fact]
    public void The_owner_may_sign_when_the_template_allows_it()
    {
        _case.AssignItem("beta.one", People.ReviewerA.UserId, People.ReviewerA.DisplayName, People.Coordinator, Clock.At(1));
        _case.PrepareForSignOff("beta.one", People.ReviewerA, Clock.At(2));

        _case.SignNow("beta.one", People.ReviewerA, Clock.At(3));

        Assert.Equal(ItemState.SignedOff, _case.Item("beta.one").State);
    }

    [Fact]
    public void An_item_that_needs_two_sign_offs_stays_ready_after_the_first()
    {
        _case.PrepareForSignOff("alpha.two", People.ReviewerA, Clock.At(1));

        _case.SignNow("alpha.two", People.ReviewerB, Clock.At(2));

        var item = _case.Item("alpha.two");
        Assert.Equal(ItemState.ReadyForSignOff, item.State);
        Assert.Single(item.CurrentSignOffs);
        Assert.Contains("(1 of 2)", _case.Timeline[^1].Text, StringComparison.Ordinal);

        _case.SignNow("alpha.two", People.ReviewerC, Clock.At(3));

        Assert.Equal(ItemState.SignedOff, item.State);
        Assert.Equal(2, item.CurrentSignOffs.Count());
    }

    [Fact]
    public void The_same_person_cannot_sign_the_same_item_twice()
    {
        _case.PrepareForSignOff("alpha.two", People.ReviewerA, Clock.At(1));
        _case.SignNow("alpha.two", People.ReviewerB, Clock.At(2));

        var ex = Assert.Throws<DomainRuleException>(() => _case.SignNow("alpha.two", People.ReviewerB, Clock.At(3)));

        Assert.Equal("distinct-signers", ex.Rule);
        Assert.Single(_case.Item("alpha.two").SignOffs);
    }

    [Fact]
    public void Signing_against_an_old_fingerprint_is_refused_because_the_evidence_changed()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));
        var seen = _case.Item("alpha.one").Fingerprint();
        _case.AddNote("alpha.one", "A late addition.", People.ReviewerA, Clock.At(2));

        var ex = Assert.Throws<DomainRuleException>(() =>
            _case.SignItem("alpha.one", People.ReviewerB, SignOffMeaning.Reviewed, "ok", seen, Clock.At(3), GpsUtc.FromUtc(Clock.At(3).UtcDateTime)));

        Assert.Equal("evidence-changed", ex.Rule);
        Assert.Contains(seen[..12], ex.Message, StringComparison.Ordinal);
        Assert.Empty(_case.Item("alpha.one").SignOffs);
    }

    [Fact]
    public void New_evidence_after_signing_makes_the_sign_offs_stale_and_the_item_ready_again()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));
        var signOff = _case.SignNow("alpha.one", People.ReviewerB, Clock.At(2));

        _case.AddNote("alpha.one", "Found one more plot.", People.ReviewerA, Clock.At(3));

        var item = _case.Item("alpha.one");
        Assert.True(signOff.IsStale);
        Assert.Equal(Clock.At(3), signOff.StaleSince);
        Assert.Equal(ItemState.ReadyForSignOff, item.State);
        Assert.True(item.HasStaleSignOffs);
        Assert.Empty(item.CurrentSignOffs);
        Assert.Equal(1, _case.StaleItemCount);
        Assert.Equal(0, _case.SignedItemCount);
        Assert.Equal("signoff.stale", _case.Timeline[^1].Kind);
        Assert.Equal("alpha.one", _case.Timeline[^1].ItemKey);
    }

    [Fact]
    public void A_new_computation_also_makes_the_sign_offs_stale()
    {
        _case.PrepareForSignOff("beta.one", People.ReviewerA, Clock.At(1));
        var signOff = _case.SignNow("beta.one", People.ReviewerB, Clock.At(2));
        var record = new ComputationRecord(CheckKind.Timing, "{}", new string('b', 64), "1.0", "{}", "consistent", "ok", "", People.ReviewerA, Clock.At(3));

        _case.AddComputation("beta.one", record, People.ReviewerA, Clock.At(3));

        Assert.True(signOff.IsStale);
        Assert.Equal(ItemState.ReadyForSignOff, _case.Item("beta.one").State);
    }

    [Fact]
    public void A_stale_item_signed_again_is_signed_off_and_keeps_the_old_stale_sign_off_on_record()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));
        _case.SignNow("alpha.one", People.ReviewerB, Clock.At(2));
        _case.AddNote("alpha.one", "Addendum.", People.ReviewerA, Clock.At(3));

        var again = _case.SignNow("alpha.one", People.ReviewerB, Clock.At(4));

        var item = _case.Item("alpha.one");
        Assert.Equal(ItemState.SignedOff, item.State);
        Assert.False(item.HasStaleSignOffs);
        Assert.Equal(2, item.SignOffs.Count);
        Assert.Single(item.SignOffs, s => s.IsStale);
        Assert.Equal(item.Fingerprint(), again.EvidenceFingerprint);
        Assert.Equal(0, _case.StaleItemCount);
    }

    [Fact]
    public void After_evidence_changes_an_item_needing_two_sign_offs_needs_two_fresh_ones()
    {
        _case.PrepareForSignOff("alpha.two", People.ReviewerA, Clock.At(1));
        _case.SignNow("alpha.two", People.ReviewerB, Clock.At(2));
        _case.SignNow("alpha.two", People.ReviewerC, Clock.At(3));
        _case.AddNote("alpha.two", "Correction.", People.ReviewerA, Clock.At(4));

        _case.SignNow("alpha.two", People.ReviewerB, Clock.At(5));

        Assert.Equal(ItemState.ReadyForSignOff, _case.Item("alpha.two").State);
        _case.SignNow("alpha.two", People.ReviewerC, Clock.At(6));
        Assert.Equal(ItemState.SignedOff, _case.Item("alpha.two").State);
        Assert.Equal(2, _case.Item("alpha.two").SignOffs.Count(s => s.IsStale));
    }

    [Fact]
    public void Evidence_added_to_a_ready_item_without_signatures_keeps_it_ready_and_records_nothing_stale()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));

        _case.AddNote("alpha.one", "More.", People.ReviewerA, Clock.At(2));

        Assert.Equal(ItemState.ReadyForSignOff, _case.Item("alpha.one").State);
        Assert.DoesNotContain(_case.Timeline, a => a.Kind == "signoff.stale");
    }
}
