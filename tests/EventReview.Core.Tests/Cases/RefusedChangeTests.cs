using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Tests.Builders;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Cases;

public class RefusedChangeTests
{
    /// <summary>A case in a state where each refusal below can happen: alpha.one owned by A and ready; alpha.two ready with one signature by B; beta.one open.</summary>
    private static ReviewCase Prepared()
    {
        var c = new CaseBuilder().Build();
        c.AssignItem("alpha.one", People.ReviewerA.UserId, People.ReviewerA.DisplayName, People.Coordinator, Clock.At(1));
        c.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(2));
        c.PrepareForSignOff("alpha.two", People.ReviewerA, Clock.At(3));
        c.SignNow("alpha.two", People.ReviewerB, Clock.At(4));
        return c;
    }

    public static TheoryData<string, string> Refusals() => new()
    {
        { "four-eyes", "four-eyes" },
        { "second signature by the same person", "distinct-signers" },
        { "old fingerprint", "evidence-changed" },
        { "sign an open item", "not-ready" },
        { "ready without evidence", "evidence-required" },
        { "withdraw a signed item", "withdraw-signed" },
        { "start a ready item", "invalid-transition" },
        { "submit with unsigned items", "unsigned-items" },
        { "close with unsigned items", "unsigned-items" },
        { "close without statement", "statement-required" },
        { "return a case in review", "invalid-transition" },
    };

    [Theory]
    [MemberData(nameof(Refusals))]
    public void A_refused_change_names_its_rule_and_leaves_the_case_exactly_as_it_was(string refusal, string rule)
    {
        var c = Prepared();
        var before = CaseSnapshot.Of(c);
        var at = Clock.At(10);
        var gps = GpsUtc.FromUtc(at.UtcDateTime);

        Action attempt = refusal switch
        {
            "four-eyes" => () => c.SignNow("alpha.one", People.ReviewerA, at),
            "second signature by the same person" => () => c.SignNow("alpha.two", People.ReviewerB, at),
            "old fingerprint" => () => c.SignItem("alpha.one", People.ReviewerC, SignOffMeaning.Reviewed, "ok", EvidenceFingerprint.Compute(Array.Empty<EvidenceItem>(), Array.Empty<ComputationRecord>()), at, gps),
            "sign an open item" => () => c.SignNow("beta.one", People.ReviewerC, at),
            "ready without evidence" => () => c.MarkItemReady("beta.one", People.ReviewerA, at),
            "withdraw a signed item" => () => c.WithdrawItem("alpha.two", People.ReviewerA, at),
            "start a ready item" => () => c.StartItem("alpha.one", People.ReviewerA, at),
            "submit with unsigned items" => () => c.SubmitForDecision(People.Coordinator, at),
            "close with unsigned items" => () => c.Close(CaseOutcome.Astrophysical, "Done.", People.Coordinator, at),
            "close without statement" => () => c.Close(CaseOutcome.Astrophysical, "", People.Coordinator, at),
            "return a case in review" => () => c.ReturnToReview("why", People.Coordinator, at),
            _ => throw new ArgumentOutOfRangeException(nameof(refusal)),
        };

        var ex = Assert.Throws<DomainRuleException>(attempt);

        Assert.Equal(rule, ex.Rule);
        Assert.False(string.IsNullOrWhiteSpace(ex.Message));
        Assert.Equal(before, CaseSnapshot.Of(c));
        Assert.Null(TimelineChain.FirstProblem(c.Timeline));
    }
}
