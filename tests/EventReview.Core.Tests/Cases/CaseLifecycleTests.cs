using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Tests.Builders;

namespace EventReview.Core.Tests.Cases;

public class CaseLifecycleTests
{
    private readonly ReviewCase _case = new CaseBuilder().Build();

    [Fact]
    public void A_case_with_unsigned_items_cannot_be_submitted_and_the_message_names_them()
    {
        _case.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));
        _case.SignNow("alpha.one", People.ReviewerB, Clock.At(2));

        var ex = Assert.Throws<DomainRuleException>(() => _case.SubmitForDecision(People.Coordinator, Clock.At(3)));

        Assert.Equal("unsigned-items", ex.Rule);
        Assert.Contains("2 required item(s)", ex.Message, StringComparison.Ordinal);
        Assert.Contains("alpha.two", ex.Message, StringComparison.Ordinal);
        Assert.Contains("beta.one", ex.Message, StringComparison.Ordinal);
        Assert.DoesNotContain("alpha.one", ex.Message, StringComparison.Ordinal);
        Assert.Equal(CaseState.InReview, _case.State);
    }

    [Fact]
    public void A_case_with_a_stale_sign_off_cannot_be_submitted_and_the_message_names_the_item()
    {
        _case.SignEverything(Clock.At(1));
        _case.AddNote("beta.one", "Late plot.", People.ReviewerA, Clock.At(2));

        var ex = Assert.Throws<DomainRuleException>(() => _case.SubmitForDecision(People.Coordinator, Clock.At(3)));

        Assert.Equal("stale-signoff", ex.Rule);
        Assert.Contains("beta.one", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_fully_signed_case_goes_to_awaiting_decision()
    {
        _case.SignEverything(Clock.At(1));

        _case.SubmitForDecision(People.Coordinator, Clock.At(2));

        Assert.Equal(CaseState.AwaitingDecision, _case.State);
        Assert.Equal("case.state", _case.Timeline[^1].Kind);
        Assert.Equal(3, _case.SignedItemCount);
    }

    [Fact]
    public void A_case_awaiting_decision_cannot_be_submitted_again()
    {
        _case.SignEverything(Clock.At(1));
        _case.SubmitForDecision(People.Coordinator, Clock.At(2));

        Assert.Equal("invalid-transition", Assert.Throws<DomainRuleException>(() => _case.SubmitForDecision(People.Coordinator, Clock.At(3))).Rule);
    }

    [Fact]
    public void A_case_awaiting_decision_can_be_returned_to_review_with_the_reason_recorded()
    {
        _case.SignEverything(Clock.At(1));
        _case.SubmitForDecision(People.Coordinator, Clock.At(2));

        _case.ReturnToReview("The decision board wants a longer background run.", People.Coordinator, Clock.At(3));

        Assert.Equal(CaseState.InReview, _case.State);
        Assert.Contains("longer background run", _case.Timeline[^1].Text, StringComparison.Ordinal);
    }

    [Fact]
    public void Only_a_case_awaiting_decision_can_be_returned_to_review()
    {
        var ex = Assert.Throws<DomainRuleException>(() => _case.ReturnToReview("why", People.Coordinator, Clock.At(1)));

        Assert.Equal("invalid-transition", ex.Rule);
        Assert.Equal(CaseState.Open, _case.State);
    }

    [Fact]
    public void New_evidence_while_awaiting_decision_sends_the_case_back_to_review()
    {
        _case.SignEverything(Clock.At(1));
        _case.SubmitForDecision(People.Coordinator, Clock.At(2));

        _case.AddNote("alpha.one", "Something new came up.", People.ReviewerA, Clock.At(3));

        Assert.Equal(CaseState.InReview, _case.State);
        Assert.Equal(["signoff.stale", "case.state"], _case.Timeline.TakeLast(2).Select(a => a.Kind));
    }

    [Fact]
    public void Closing_needs_a_statement()
    {
        _case.SignEverything(Clock.At(1));

        var ex = Assert.Throws<DomainRuleException>(() => _case.Close(CaseOutcome.Instrumental, "  ", People.Coordinator, Clock.At(2)));

        Assert.Equal("statement-required", ex.Rule);
        Assert.NotEqual(CaseState.Closed, _case.State);
    }

    [Fact]
    public void A_case_with_unsigned_items_cannot_be_closed()
    {
        var ex = Assert.Throws<DomainRuleException>(() => _case.Close(CaseOutcome.Inconclusive, "No decision possible.", People.Coordinator, Clock.At(1)));

        Assert.Equal("unsigned-items", ex.Rule);
        Assert.Contains("close it", ex.Message, StringComparison.Ordinal);
        Assert.Null(_case.Outcome);
    }

    [Fact]
    public void A_case_with_a_stale_sign_off_cannot_be_closed()
    {
        _case.SignEverything(Clock.At(1));
        _case.AddNote("alpha.two", "Changed my mind.", People.ReviewerA, Clock.At(2));

        Assert.Equal("stale-signoff", Assert.Throws<DomainRuleException>(() => _case.Close(CaseOutcome.Astrophysical, "Real.", People.Coordinator, Clock.At(3))).Rule);
    }

    [Fact]
    public void A_signed_case_awaiting_decision_closes_with_its_outcome_and_statement()
    {
        _case.SignEverything(Clock.At(1));
        _case.SubmitForDecision(People.Coordinator, Clock.At(2));

        _case.Close(CaseOutcome.Injection, "  It was a hardware injection.  ", People.Coordinator, Clock.At(3));

        Assert.Equal(CaseState.Closed, _case.State);
        Assert.Equal(CaseOutcome.Injection, _case.Outcome);
        Assert.Equal("It was a hardware injection.", _case.ClosingStatement);
        Assert.Equal("case.closed", _case.Timeline[^1].Kind);
        Assert.Contains("injection", _case.Timeline[^1].Text, StringComparison.Ordinal);
    }

    [Fact]
    public void A_signed_case_in_review_may_be_closed_without_the_submit_step()
    {
        _case.SignEverything(Clock.At(1));

        _case.Close(CaseOutcome.Instrumental, "A glitch at one site.", People.Coordinator, Clock.At(2));

        Assert.Equal(CaseState.Closed, _case.State);
    }

    public static TheoryData<string, string> ChangesToAClosedCase() => new()
    {
        { "start", "case-closed" },
        { "ready", "case-closed" },
        { "withdraw", "case-closed" },
        { "note", "case-closed" },
        { "computation", "case-closed" },
        { "sign", "case-closed" },
        { "assign", "case-closed" },
        { "due", "case-closed" },
        { "submit", "case-closed" },
        { "close", "case-closed" },
        { "return", "invalid-transition" },
    };

    [Theory]
    [MemberData(nameof(ChangesToAClosedCase))]
    public void A_closed_case_refuses_every_change_and_stays_as_it_was(string change, string rule)
    {
        _case.SignEverything(Clock.At(1));
        _case.Close(CaseOutcome.Instrumental, "A glitch.", People.Coordinator, Clock.At(2));
        var before = CaseSnapshot.Of(_case);

        var ex = Assert.Throws<DomainRuleException>(() => Changes.Apply(_case, change, Clock.At(3)));

        Assert.Equal(rule, ex.Rule);
        Assert.Equal(before, CaseSnapshot.Of(_case));
        Assert.Equal(CaseState.Closed, _case.State);
    }

    [Fact]
    public void Every_item_state_and_case_state_has_a_plain_name()
    {
        Assert.Equal(["open", "in progress", "ready for sign-off", "signed off"], Enum.GetValues<ItemState>().Select(StateNames.Of));
        Assert.Equal(["open", "in review", "awaiting decision", "closed"], Enum.GetValues<CaseState>().Select(StateNames.Of));
        Assert.Equal("inconclusive", StateNames.Of(CaseOutcome.Inconclusive));
    }
}
