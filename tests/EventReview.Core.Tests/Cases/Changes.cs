using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Tests.Builders;

namespace EventReview.Core.Tests.Cases;

/// <summary>Named changes of the default test case, for tables of refused changes.</summary>
public static class Changes
{
    public static void Apply(ReviewCase c, string change, DateTimeOffset at)
    {
        switch (change)
        {
            case "start": c.StartItem("alpha.one", People.ReviewerA, at); break;
            case "ready": c.MarkItemReady("alpha.one", People.ReviewerA, at); break;
            case "withdraw": c.WithdrawItem("alpha.one", People.ReviewerA, at); break;
            case "note": c.AddNote("alpha.one", "late note", People.ReviewerA, at); break;
            case "computation":
                c.AddComputation("beta.one", new ComputationRecord(CheckKind.Timing, "{}", new string('c', 64), "1", "{}", "clear", "s", "", People.ReviewerA, at), People.ReviewerA, at);
                break;
            case "sign": c.SignNow("alpha.one", People.ReviewerC, at); break;
            case "assign": c.AssignItem("alpha.two", People.ReviewerC.UserId, People.ReviewerC.DisplayName, People.Coordinator, at); break;
            case "due": c.SetItemDue("alpha.two", new DateOnly(2027, 1, 1), People.Coordinator, at); break;
            case "submit": c.SubmitForDecision(People.Coordinator, at); break;
            case "close": c.Close(CaseOutcome.Astrophysical, "again", People.Coordinator, at); break;
            case "return": c.ReturnToReview("again", People.Coordinator, at); break;
            default: throw new ArgumentOutOfRangeException(nameof(change), change, "unknown change");
        }
    }
}
